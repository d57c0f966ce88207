"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { newVersionAction } from "@/lib/protocols/actions";
import { ActionStatus } from "./action-status";

/** Starts the next version as a draft copy of the latest, then opens it. */
export function NewVersionButton({ protocolId, nextNumber }: { protocolId: number; nextNumber: number }) {
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  return (
    <div className="space-y-2">
      <button
        type="button"
        className="btn-quiet"
        disabled={pending}
        onClick={() =>
          start(async () => {
            const r = await newVersionAction(protocolId);
            setStatus({ ok: r.ok, text: r.message ?? "" });
            if (r.ok && r.data) router.push(`/protocols/${protocolId}/versions/${r.data.number}`);
          })
        }
      >
        Start version {nextNumber}
      </button>
      <ActionStatus status={status} />
    </div>
  );
}
