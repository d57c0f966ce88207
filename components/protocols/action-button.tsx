"use client";

import { useState, useTransition } from "react";
import { useHydrated } from "@/components/forms/use-hydrated";
import type { ActionResult } from "@/lib/http/action-result";
import { ActionStatus } from "./action-status";

/**
 * A button that runs one server action, shows its outcome under it, and calls `onDone` after success. Disabled until
 * hydrated and while the action runs, so a click is never lost or sent twice.
 * @example <ActionButton label="Submit for review" act={() => submitVersionAction(ids)} onDone={() => router.refresh()} />
 */
export function ActionButton<T>({ label, className = "btn", hint, act, onDone }: {
  label: React.ReactNode;
  className?: string;
  hint?: string;
  act: () => Promise<ActionResult<T>>;
  onDone: (result: Extract<ActionResult<T>, { ok: true }>) => void;
}) {
  const hydrated = useHydrated();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  return (
    <div className="space-y-2">
      <button
        type="button"
        className={className}
        disabled={!hydrated || pending}
        onClick={() =>
          start(async () => {
            const r = await act();
            setStatus({ ok: r.ok, text: r.message ?? "" });
            if (r.ok) onDone(r);
          })
        }
      >
        {label}
      </button>
      {hint && <p className="hint">{hint}</p>}
      <ActionStatus status={status} />
    </div>
  );
}
