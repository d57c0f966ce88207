"use client";

import Link from "next/link";
import { SaveStatus } from "./save-status";
import type { SaveState } from "./use-autosave";
import { useHydrated } from "@/components/forms/use-hydrated";

/** Back link, save status and the Next button at the foot of a step. */
export function StepFooter({ backHref, nextLabel, state, busy, formError }: { backHref: string | null; nextLabel: string; state: SaveState; busy?: boolean; formError?: string | null }) {
  const hydrated = useHydrated();
  return (
    <div className="mt-6 flex flex-wrap items-center gap-4 border-t border-paper-line pt-4">
      {backHref && <Link href={backHref} className="btn-quiet">← Back</Link>}
      <button type="submit" className="btn" disabled={!hydrated || busy}>{nextLabel} →</button>
      <SaveStatus state={state} />
      {formError && <p className="field-error w-full" data-testid="form-error">{formError}</p>}
    </div>
  );
}
