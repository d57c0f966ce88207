"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { useHydrated } from "@/components/forms/use-hydrated";
import { requestPasswordResetAction } from "@/lib/users/actions";
import { resetRequestSchema } from "@/lib/users/schemas";

type Values = z.input<typeof resetRequestSchema>;

/** "Forgot your password?": asks for the e-mail; the answer is the same whether or not it has an account. */
export function ResetRequestForm() {
  const hydrated = useHydrated();
  const [answer, setAnswer] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, formState: { errors, isSubmitting } } = useForm<Values>({ resolver: zodResolver(resetRequestSchema) });

  async function onSubmit(values: Values) {
    const result = await requestPasswordResetAction(values);
    setAnswer({ ok: result.ok, text: result.ok ? (result.message ?? "") : result.message });
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      <label className="field">
        <span>Email</span>
        <input className="input" type="email" autoComplete="username" {...register("email")} aria-invalid={!!errors.email} />
        {errors.email && <p className="field-error">{errors.email.message}</p>}
      </label>
      {answer && <p className={`text-sm ${answer.ok ? "text-moss-dark" : "text-danger"}`} data-testid="reset-answer">{answer.text}</p>}
      <button type="submit" className="btn w-full justify-center" disabled={!hydrated || isSubmitting}>Send me a link</button>
    </form>
  );
}
