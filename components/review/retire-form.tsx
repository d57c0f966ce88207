"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { retireVersionAction } from "@/lib/protocols/actions";
import { ActionStatus } from "@/components/protocols/action-status";
import { useHydrated } from "@/components/forms/use-hydrated";

/** Withdraws an approved version from bench use, with a reason. */
export function RetireForm({ versionId, lockVersion }: { versionId: number; lockVersion: number }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [reason, setReason] = useState("");
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  return (
    <details className="rounded-md border border-paper-line p-3">
      <summary className="cursor-pointer text-sm font-medium">Retire this version…</summary>
      <form
        className="mt-3 space-y-3"
        onSubmit={(e) => {
          e.preventDefault();
          start(async () => {
            const r = await retireVersionAction({ versionId, lockVersion, reason });
            setStatus({ ok: r.ok, text: r.message ?? "" });
            if (r.ok) router.refresh();
          });
        }}
      >
        <label className="field">
          <span>Reason for retiring</span>
          <textarea className="input min-h-20" value={reason} onChange={(e) => setReason(e.target.value)} />
        </label>
        <button type="submit" className="btn-danger" disabled={!hydrated || pending}>Retire version</button>
        <ActionStatus status={status} />
      </form>
    </details>
  );
}
