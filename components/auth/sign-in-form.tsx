"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { signIn } from "next-auth/react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { signInSchema, type SignInInput } from "@/lib/users/schemas";
import { SIGN_IN_UNAVAILABLE } from "@/lib/http/outage-codes";
import { useHydrated } from "@/components/forms/use-hydrated";

/** E-mail and password form; a refusal is shown in words, never as a crash. `callbackUrl` is a checked same-origin path. */
export function SignInForm({ callbackUrl }: { callbackUrl: string }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema) });

  async function onSubmit(values: SignInInput) {
    setFailure(null);
    const result = await signIn("credentials", { ...values, callbackUrl, redirect: false });
    if (result?.error === SIGN_IN_UNAVAILABLE) {
      setFailure("Sign-in is unavailable: the service cannot reach its database. Your password was not checked; try again in a minute.");
      return;
    }
    if (!result || result.error) {
      // next-auth says "CredentialsSignin" for a wrong password; any other text is our own (when to try again).
      setFailure(
        !result || result.error === "CredentialsSignin"
          ? "That e-mail and password do not match an active account. Check both, or ask your admin."
          : result.error,
      );
      return;
    }
    router.push(callbackUrl);
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      <label className="field">
        <span>Email</span>
        <input className="input" type="email" autoComplete="username" {...register("email")} aria-invalid={!!errors.email} />
        {errors.email && <p className="field-error">{errors.email.message}</p>}
      </label>
      <label className="field">
        <span>Password</span>
        <input className="input" type="password" autoComplete="current-password" {...register("password")} aria-invalid={!!errors.password} />
        {errors.password && <p className="field-error">{errors.password.message}</p>}
      </label>
      {failure && (
        <p className="rounded-md border border-danger/30 bg-danger-light p-2 text-sm text-danger" data-testid="signin-error">
          {failure}
        </p>
      )}
      <button type="submit" className="btn w-full justify-center" disabled={!hydrated || isSubmitting}>
        {isSubmitting ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
