"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { useHydrated } from "@/components/forms/use-hydrated";
import { changePasswordAction } from "@/lib/users/actions";
import { changePasswordSchema } from "@/lib/users/schemas";

type Values = z.input<typeof changePasswordSchema>;
const FIELDS = ["current", "password", "confirm"] as const;

/** Settings → change my password (the current one is required; other sessions are signed out). */
export function ChangePasswordForm() {
  const hydrated = useHydrated();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, setError, reset, formState: { errors, isSubmitting } } = useForm<Values>({
    resolver: zodResolver(changePasswordSchema),
    defaultValues: { current: "", password: "", confirm: "" },
  });

  async function onSubmit(values: Values) {
    const result = await changePasswordAction(values);
    if (!result.ok) {
      for (const [field, message] of Object.entries(result.fieldErrors ?? {})) {
        if ((FIELDS as readonly string[]).includes(field)) setError(field as (typeof FIELDS)[number], { message });
      }
      setStatus({ ok: false, text: result.message });
      return;
    }
    reset({ current: "", password: "", confirm: "" });
    setStatus({ ok: true, text: result.message ?? "Password changed." });
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="grid gap-4 sm:grid-cols-3" noValidate aria-label="Change my password">
      <label className="field">
        <span>Current password</span>
        <input className="input" type="password" autoComplete="current-password" {...register("current")} aria-invalid={!!errors.current} />
        {errors.current && <p className="field-error">{errors.current.message}</p>}
      </label>
      <label className="field">
        <span>New password</span>
        <input className="input" type="password" autoComplete="new-password" {...register("password")} aria-invalid={!!errors.password} />
        <p className="hint">12 to 72 characters.</p>
        {errors.password && <p className="field-error">{errors.password.message}</p>}
      </label>
      <label className="field">
        <span>Repeat the new password</span>
        <input className="input" type="password" autoComplete="new-password" {...register("confirm")} aria-invalid={!!errors.confirm} />
        {errors.confirm && <p className="field-error">{errors.confirm.message}</p>}
      </label>
      <div className="flex items-center gap-3 sm:col-span-3">
        <button className="btn" type="submit" disabled={!hydrated || isSubmitting}>Change my password</button>
        {status && <p className={`text-sm ${status.ok ? "text-moss-dark" : "text-danger"}`} data-testid="change-password-status">{status.text}</p>}
      </div>
    </form>
  );
}
