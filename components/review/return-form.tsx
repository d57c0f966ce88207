"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { returnVersionAction } from "@/lib/protocols/actions";
import { ActionStatus } from "@/components/protocols/action-status";
import { useHydrated } from "@/components/forms/use-hydrated";

/** Returns a version in review to its author with a comment (required). */
export function ReturnForm({ versionId, lockVersion }: { versionId: number; lockVersion: number }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [comment, setComment] = useState("");
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        start(async () => {
          const r = await returnVersionAction({ versionId, lockVersion, comment });
          setStatus({ ok: r.ok, text: r.ok ? r.message ?? "" : r.fieldErrors?.comment ?? r.message });
          if (r.ok) router.refresh();
        });
      }}
    >
      <label className="field">
        <span>Comment to the author</span>
        <textarea className="input min-h-24" value={comment} onChange={(e) => setComment(e.target.value)} />
        <p className="hint">Say what must change. The author is e-mailed this text.</p>
      </label>
      <button type="submit" className="btn-quiet" disabled={!hydrated || pending}>Return to author</button>
      <ActionStatus status={status} testId="return-status" />
    </form>
  );
}
