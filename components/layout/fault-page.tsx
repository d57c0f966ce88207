"use client";

import Link from "next/link";
import { DB_UNAVAILABLE_DIGEST } from "@/lib/http/outage-codes";

/** What a fault page says: the database outage in its own words, anything else as an unexpected error with its reference. */
export function faultText(digest: string | undefined): { title: string; body: string; reference: string | null } {
  if (digest === DB_UNAVAILABLE_DIGEST) {
    return {
      title: "The database is unavailable",
      body: "Sievewright cannot reach its database just now, so this page cannot be shown and nothing can be saved. Nothing you saved earlier is lost. Try again in a minute; if it lasts, tell whoever runs Sievewright for your lab.",
      reference: null,
    };
  }
  return {
    title: "Something went wrong on our side",
    body: "The page could not be shown because of an error in Sievewright, not in anything you did. It has been logged. Try again; if it happens again, tell whoever runs Sievewright for your lab and quote the reference below.",
    reference: digest ?? null,
  };
}

/**
 * The body of the error pages (app/error.tsx and app/global-error.tsx): a plain explanation, a retry button and a
 * way home. `reset` re-renders the failed segment.
 */
export function FaultPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  const text = faultText(error.digest);
  return (
    <main className="mx-auto max-w-lg px-6 py-20" data-testid="fault-page">
      <h1>{text.title}</h1>
      <p className="mt-3 text-ink-soft">{text.body}</p>
      {text.reference && (
        <p className="mt-3 text-sm text-ink-soft">
          Reference: <code>{text.reference}</code>
        </p>
      )}
      <div className="mt-6 flex gap-4">
        <button type="button" className="btn" onClick={() => reset()}>
          Try again
        </button>
        <Link href="/home">Back to your home page</Link>
      </div>
    </main>
  );
}
