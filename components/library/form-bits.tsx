"use client";

import type { ReactNode } from "react";
import { useHydrated } from "@/components/forms/use-hydrated";

/** A labelled input with its unit, hint and error in words. */
export function NumberField({ label, unit, hint, error, children }: { label: string; unit?: string; hint?: ReactNode; error?: string; children: ReactNode }) {
  return (
    <label className="field">
      <span>{label}</span>
      <div className="flex items-center gap-2">
        {children}
        {unit && <span className="min-w-12 text-sm text-ink-muted">{unit}</span>}
      </div>
      {hint && <p className="hint">{hint}</p>}
      {error && <p className="field-error">{error}</p>}
    </label>
  );
}

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
