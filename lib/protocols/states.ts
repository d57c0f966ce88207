/**
 * The version lifecycle as a pure state machine (no I/O): draft → in review → approved → superseded or retired;
 * in review → returned → (reopened as a draft) → in review. Only a draft's content changes.
 */

export const VERSION_STATES = ["draft", "in_review", "approved", "returned", "superseded", "retired"] as const;
export type VersionState = (typeof VERSION_STATES)[number];

/** What each state is called on screen. */
export const STATE_LABELS: Record<VersionState, string> = {
  draft: "Draft",
  in_review: "In review",
  approved: "Approved",
  returned: "Returned",
  superseded: "Superseded",
  retired: "Retired",
};

/** The steps that move a version between states. `edit` keeps a draft a draft. */
export const VERSION_EVENTS = ["edit", "submit", "return", "reopen", "approve", "supersede", "retire"] as const;
export type VersionEvent = (typeof VERSION_EVENTS)[number];

const TRANSITIONS: Record<VersionEvent, Partial<Record<VersionState, VersionState>>> = {
  edit: { draft: "draft" },
  submit: { draft: "in_review" },
  return: { in_review: "returned" },
  reopen: { returned: "draft" },
  approve: { in_review: "approved" },
  supersede: { approved: "superseded" },
  retire: { approved: "retired" },
};

const EVENT_WORDS: Record<VersionEvent, string> = {
  edit: "edited",
  submit: "submitted for review",
  return: "returned to its author",
  reopen: "reopened as a draft",
  approve: "approved",
  supersede: "superseded",
  retire: "retired",
};

/**
 * The state a version moves to on `event`, or null when the step is not allowed from `from`.
 * @example nextState("in_review", "approve") // "approved"; nextState("approved", "edit") // null
 */
export function nextState(from: VersionState, event: VersionEvent): VersionState | null {
  return TRANSITIONS[event][from] ?? null;
}

/**
 * Why `event` is refused from `from`, in words; null when it is allowed.
 * @example refusal("approved", "edit") // "An approved version cannot be edited: only a draft can. …"
 */
export function refusal(from: VersionState, event: VersionEvent): string | null {
  if (nextState(from, event)) return null;
  const allowedFrom = Object.keys(TRANSITIONS[event]).map((s) => STATE_LABELS[s as VersionState].toLowerCase());
  const article = from === "approved" || from === "in_review" ? "An" : "A";
  const extra = event !== "edit" ? "" : from === "in_review" ? " Ask a reviewer to return it first." : from === "returned" ? " Reopen it as a draft first." : " Start a new version to change it.";
  return `${article} ${STATE_LABELS[from].toLowerCase()} version cannot be ${EVENT_WORDS[event]}: only a version that is ${allowedFrom.join(" or ")} can.${extra}`;
}

/** States in which a version is still being worked on (at most one per protocol). */
export const OPEN_STATES: readonly VersionState[] = ["draft", "in_review", "returned"];

/** States a version reaches only after a signature. */
export const SIGNED_STATES: readonly VersionState[] = ["approved", "superseded", "retired"];

/**
 * States in which a version's content, and so every library item version it refers to, is frozen: the version can
 * neither be edited nor reopened as a draft (in review, approved, superseded, retired). Derived from the transitions.
 * @example LOCKING_STATES // ["in_review", "approved", "superseded", "retired"]
 */
export const LOCKING_STATES: readonly VersionState[] = VERSION_STATES.filter((s) => !nextState(s, "edit") && !nextState(s, "reopen"));

/**
 * Whether a version in this state freezes what it refers to (see LOCKING_STATES).
 * @example isLocking("returned") // false
 */
export function isLocking(state: string): boolean {
  return (LOCKING_STATES as readonly string[]).includes(state);
}

/**
 * The "ready for the bench" rule: the version is approved, signed, every signature covers the version's content hash,
 * and re-hashing the stored content found no problem (`integrityProblems` from checkIntegrity, empty when intact).
 * @example isBenchReady({ state: "approved", contentHash: h }, [{ contentHash: h }], []) // true
 */
export function isBenchReady(version: { state: VersionState; contentHash: string }, signatures: readonly { contentHash: string }[], integrityProblems: readonly string[] = []): boolean {
  return integrityProblems.length === 0 && version.state === "approved" && signatures.length > 0 && signatures.every((s) => s.contentHash === version.contentHash);
}

/**
 * Whether the version is open (draft, in review or returned).
 * @example isOpen("returned") // true
 */
export function isOpen(state: VersionState): boolean {
  return OPEN_STATES.includes(state);
}
