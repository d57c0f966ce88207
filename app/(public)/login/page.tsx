import { readEnv } from "@/lib/env";
import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Wordmark } from "@/components/layout/wordmark";
import { safeRedirectPath } from "@/lib/auth/redirect";
import { currentUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Sign in" };

export default async function LoginPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string | string[] }> }) {
  if (await currentUser()) redirect("/home");
  const { callbackUrl } = await searchParams;
  const safeCallback = safeRedirectPath(callbackUrl, readEnv().APP_BASE_URL);
  return (
    <main className="mx-auto flex min-h-screen max-w-4xl flex-col items-center justify-center gap-10 px-6 md:flex-row md:items-center">
      <section className="flex max-w-sm flex-col justify-center gap-4">
        <Wordmark size={36} />
        <p className="text-ink-soft">
          Choose a drive frequency, buffer and voltage that move live and dead cells in opposite directions — then get the
          protocol signed off and onto the bench.
        </p>
        <p className="text-xs text-ink-muted">
          Predictions are model estimates. Verify at the bench and follow your institution&apos;s electrical-safety and
          biosafety rules.
        </p>
      </section>
      <section className="card w-full max-w-sm">
        <h1 className="mb-4">Sign in</h1>
        <SignInForm callbackUrl={safeCallback} />
        <p className="mt-4 text-sm"><Link href="/login/reset">Forgot your password?</Link></p>
      </section>
    </main>
  );
}
