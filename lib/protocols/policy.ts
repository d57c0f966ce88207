import type { Role } from "@/lib/auth/roles";
import type { VersionState } from "./states";
import { isOpen } from "./states";

/**
 * Who may do what to a protocol version (pure; the service calls these before every change, the screens call them to
 * decide which buttons to show). Each rule returns null when allowed, or the reason in words.
 */

export interface PolicyActor {
  id: number;
  role: Role;
}

/** What the rules need to know about a version: its state, its author and everyone who edited it. */
export interface PolicyVersion {
  state: VersionState;
  authorId: number;
  editorIds: readonly number[];
}

export type VersionAction = "view" | "edit" | "submit" | "return" | "approve" | "retire";

/**
 * Reason `actor` may not take `action` on `version` (role and separation-of-duty rules only; the state machine is
 * checked separately); null when allowed.
 * @example denial({ id: 2, role: "reviewer" }, "approve", { state: "in_review", authorId: 2, editorIds: [2] })
 *   // "You authored this version; another reviewer must approve it."
 */
export function denial(actor: PolicyActor, action: VersionAction, version: PolicyVersion): string | null {
  switch (action) {
    case "view":
      if (actor.role === "admin") return "Admins manage accounts; protocol content is not shown to them.";
      if (actor.role === "technician" && version.state !== "approved") return "Technicians see approved, current versions only.";
      return null;
    case "edit":
      return actor.role === "developer" ? null : "Only an assay developer edits a draft.";
    case "submit":
      if (actor.role !== "developer") return "Only the assay developer who authored the version submits it.";
      return actor.id === version.authorId ? null : "Only the author of this version may submit it.";
    case "return":
      return actor.role === "reviewer" ? null : "Only a QA reviewer returns a version.";
    case "approve":
      if (actor.role !== "reviewer") return "Only a QA reviewer signs a version off.";
      if (actor.id === version.authorId) return "You authored this version; another reviewer must approve it.";
      if (version.editorIds.includes(actor.id)) return "You edited this version; another reviewer must approve it.";
      return null;
    case "retire":
      return actor.role === "reviewer" ? null : "Only a QA reviewer retires a version.";
  }
}

/**
 * Whether `actor` may start a new version of a protocol whose latest version is in `latestState`; null when allowed.
 * @example newVersionDenial({ id: 1, role: "developer" }, "draft") // "The latest version is still open (draft, in review or returned); …"
 */
export function newVersionDenial(actor: PolicyActor, latestState: VersionState): string | null {
  if (actor.role !== "developer") return "Only an assay developer starts a new version.";
  if (isOpen(latestState)) return "The latest version is still open (draft, in review or returned); finish it before starting another.";
  return null;
}

/**
 * Whether `role` may create protocols at all; null when allowed.
 * @example authorDenial("admin") // "Only an assay developer creates protocols."
 */
export function authorDenial(role: Role): string | null {
  return role === "developer" ? null : "Only an assay developer creates protocols.";
}
