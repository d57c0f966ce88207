import { STATE_LABELS, type VersionState } from "@/lib/protocols/states";

const STYLE: Record<VersionState, string> = {
  draft: "border-paper-line bg-paper-deep text-ink-soft",
  in_review: "border-tide/40 bg-tide-light text-tide",
  approved: "border-moss/40 bg-moss-light text-moss-dark",
  returned: "border-caution/40 bg-caution-light text-caution",
  superseded: "border-paper-line bg-white text-ink-muted line-through decoration-1",
  retired: "border-danger/30 bg-danger-light text-danger",
};

/** A version's state as a labelled pill (colour plus the word, so it reads in greyscale). */
export function StatePill({ state, testId }: { state: VersionState; testId?: string }) {
  return <span className={`pill ${STYLE[state]}`} data-testid={testId} data-state={state}>{STATE_LABELS[state]}</span>;
}
