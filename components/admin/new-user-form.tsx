"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { ROLE_LABELS, ROLES } from "@/lib/auth/roles";
import { createUserAction } from "@/lib/users/actions";
import { createUserSchema } from "@/lib/users/schemas";
import { useHydrated } from "@/components/forms/use-hydrated";

type FormValues = z.input<typeof createUserSchema>;

/** Creates an account; field errors from the server land next to their field. */
export function NewUserForm() {
  const hydrated = useHydrated();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors, isSubmitting } } = useForm<FormValues>({
    resolver: zodResolver(createUserSchema),
    defaultValues: { role: "technician" },
  });

  async function onSubmit(values: FormValues) {
    const result = await createUserAction(values);
    if (!result.ok) {
      for (const [field, message] of Object.entries(result.fieldErrors ?? {})) {
        if (field in values) setError(field as keyof FormValues, { message });
      }
      setStatus({ ok: false, text: result.message });
      return;
    }
    reset({ role: "technician", email: "", name: "" });
    setStatus({ ok: true, text: result.message ?? "Created." });
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="grid gap-4 sm:grid-cols-2" noValidate>
      <label className="field">
        <span>Name</span>
        <input className="input" {...register("name")} />
        {errors.name && <p className="field-error">{errors.name.message}</p>}
      </label>
      <label className="field">
        <span>Email</span>
        <input className="input" type="email" {...register("email")} />
        {errors.email && <p className="field-error">{errors.email.message}</p>}
      </label>
      <label className="field">
        <span>Role</span>
        <select className="input" {...register("role")}>
          {ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
        </select>
        {errors.role && <p className="field-error">{errors.role.message}</p>}
      </label>
      <p className="hint self-end">
        You do not choose the password: the new user gets an e-mail with a one-time link to choose their own.
      </p>
      <div className="sm:col-span-2 flex items-center gap-3">
        <button className="btn" type="submit" disabled={!hydrated || isSubmitting}>Create account</button>
        {status && <p className={`text-sm ${status.ok ? "text-moss-dark" : "text-danger"}`} role="status">{status.text}</p>}
      </div>
    </form>
  );
}
