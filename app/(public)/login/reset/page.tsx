import type { Metadata } from "next";
import Link from "next/link";
import { ResetRequestForm } from "@/components/auth/reset-request-form";
import { Wordmark } from "@/components/layout/wordmark";

export const metadata: Metadata = { title: "Forgot your password" };

export default function ResetRequestPage() {
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-6">
      <Wordmark size={30} />
      <section className="card">
        <h1 className="mb-1">Forgot your password?</h1>
        <p className="mb-4 text-sm text-ink-soft">Enter your e-mail address. If it has an active account, we send it a one-time link to choose a new password.</p>
        <ResetRequestForm />
        <p className="mt-4 text-sm"><Link href="/login">Back to sign-in</Link></p>
      </section>
    </main>
  );
}
