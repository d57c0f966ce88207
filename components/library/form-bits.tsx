"use client";

import { useHydrated } from "@/components/forms/use-hydrated";

/** The submit row with a status line. */
export function SubmitRow({ label, busy, status, hasErrors }: { label: string; busy: boolean; status: { ok: boolean; text: string } | null; hasErrors: boolean }) {
  const hydrated = useHydrated();
  return (
    <div className="flex items-center gap-3">
      <button className="btn" type="submit" disabled={!hydrated || busy}>{label}</button>
      {status && <p className={`text-sm ${status.ok ? "text-moss-dark" : "text-danger"}`} role="status">{status.text}</p>}
      {!status && hasErrors && <p className="text-sm text-danger" role="status">Some fields need attention; see the messages next to them.</p>}
    </div>
  );
}
