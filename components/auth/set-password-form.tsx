"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { useHydrated } from "@/components/forms/use-hydrated";
import { completePasswordLinkAction } from "@/lib/users/actions";
import { setPasswordSchema } from "@/lib/users/schemas";

type Values = z.input<typeof setPasswordSchema>;

/** Choose a password through a one-time link (new account or reset). */
export function SetPasswordForm({ token, email }: { token: string; email: string }) {
  const hydrated = useHydrated();
  const [done, setDone] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<Values>({
    resolver: zodResolver(setPasswordSchema),
    defaultValues: { token, password: "", confirm: "" },
  });

  async function onSubmit(values: Values) {
    setFailure(null);
    const result = await completePasswordLinkAction(values);
    if (!result.ok) {
      for (const [field, message] of Object.entries(result.fieldErrors ?? {})) {
        if (field === "password" || field === "confirm") setError(field, { message });
      }
      setFailure(result.fieldErrors?.token ?? result.message);
      return;
    }
    setDone(result.message ?? "Password saved.");
  }

  if (done) {
    return (
      <div className="space-y-3" data-testid="password-set">
        <p className="text-moss-dark">{done}</p>
        <Link className="btn" href="/login">Sign in</Link>
      </div>
    );
  }
  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      <input type="hidden" {...register("token")} />
      <input type="email" value={email} autoComplete="username" readOnly hidden />
      <label className="field">
        <span>New password</span>
        <input className="input" type="password" autoComplete="new-password" {...register("password")} aria-invalid={!!errors.password} />
        <p className="hint">12 to 72 characters. A few unrelated words make a strong one.</p>
        {errors.password && <p className="field-error">{errors.password.message}</p>}
      </label>
      <label className="field">
        <span>Repeat the new password</span>
        <input className="input" type="password" autoComplete="new-password" {...register("confirm")} aria-invalid={!!errors.confirm} />
        {errors.confirm && <p className="field-error">{errors.confirm.message}</p>}
      </label>
      {failure && <p className="rounded-md border border-danger/30 bg-danger-light p-2 text-sm text-danger" data-testid="password-link-error">{failure}</p>}
      <button type="submit" className="btn w-full justify-center" disabled={!hydrated || isSubmitting}>Save my password</button>
    </form>
  );
}
