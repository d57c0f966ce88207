import type { Metadata } from "next";
import Link from "next/link";
import { SetPasswordForm } from "@/components/auth/set-password-form";
import { Wordmark } from "@/components/layout/wordmark";
import { formatDateTime } from "@/lib/format/time";
import { describePasswordLink } from "@/lib/users/passwords";

export const metadata: Metadata = { title: "Choose your password", referrer: "no-referrer" };
export const dynamic = "force-dynamic";

const REFUSED = {
  unknown: "This link is not valid.",
  used: "This link has already been used; each link works once.",
  expired: "This link has expired.",
} as const;

export default async function PasswordLinkPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const view = await describePasswordLink(token);
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-6">
      <Wordmark size={30} />
      <section className="card">
        {view.state === "valid" ? (
          <>
            <h1 className="mb-1">{view.purpose === "setup" ? "Choose your password" : "Choose a new password"}</h1>
            <p className="mb-4 text-sm text-ink-soft">
              For {view.email}. Only you choose it; the link works once, until {formatDateTime(view.expiresAt)}. Saving signs out every open session of
              this account.
            </p>
            <SetPasswordForm token={token} email={view.email} />
          </>
        ) : (
          <>
            <h1 className="mb-2">Link not usable</h1>
            <p className="text-ink-soft" data-testid="password-link-refused">{REFUSED[view.state]}</p>
            <p className="mt-3 text-sm"><Link href="/login/reset">Ask for a new link</Link> · <Link href="/login">Sign in</Link></p>
          </>
        )}
      </section>
    </main>
  );
}
