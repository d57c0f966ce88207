"use client";

import { useRouter } from "next/navigation";
import { newVersionAction } from "@/lib/protocols/actions";
import { ActionButton } from "./action-button";

/** Starts the next version as a draft copy of the latest, then opens it. */
export function NewVersionButton({ protocolId, nextNumber }: { protocolId: number; nextNumber: number }) {
  const router = useRouter();
  return (
    <ActionButton
      label={<>Start version {nextNumber}</>}
      className="btn-quiet"
      act={() => newVersionAction(protocolId)}
      onDone={(r) => {
        if (r.data) router.push(`/protocols/${protocolId}/versions/${r.data.number}`);
      }}
    />
  );
}
