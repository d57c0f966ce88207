"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { submitVersionAction } from "@/lib/protocols/actions";
import { ActionStatus } from "./action-status";

/** The author's "Submit for review" button (sends the lock version the page was rendered with). */
export function SubmitButton({ versionId, lockVersion }: { versionId: number; lockVersion: number }) {
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  return (
    <div className="space-y-2">
      <button
        type="button"
        className="btn"
        disabled={pending}
        onClick={() =>
          start(async () => {
            const r = await submitVersionAction({ versionId, lockVersion });
            setStatus({ ok: r.ok, text: r.message ?? "" });
            if (r.ok) router.refresh();
          })
        }
      >
        Submit for review
      </button>
      <p className="hint">QA reviewers are e-mailed. The content is frozen while it is in review.</p>
      <ActionStatus status={status} />
    </div>
  );
}
