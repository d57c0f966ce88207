import type { Knex } from "knex";
import { latestEventOf } from "@/lib/audit/repo";
import { ConflictError, ForbiddenError, NotFoundError } from "@/lib/errors";
import { formatDateTime } from "@/lib/format/time";
import type { Role } from "@/lib/auth/roles";
import type { ProtocolVersion } from "./mapper";
import { denial, type VersionAction } from "./policy";
import * as repo from "./repo";
import { STATE_LABELS, refusal, type VersionEvent } from "./states";

/** Who acts: enough of a user for the rules, the audit trail and the e-mails. */
export interface Actor {
  id: number;
  email: string;
  name: string;
  role: Role;
}

/**
 * Locks the version row (SELECT … FOR UPDATE) and checks, in this order: it exists, the actor's role and separation of
 * duties allow `action`, the state allows `event`, and nobody changed it since the actor loaded `lockVersion`.
 * Throws NotFoundError / ForbiddenError / ConflictError with a message naming who did what.
 * @example const v = await lockForStep(trx, actor, 12, 3, "approve", "approve");
 */
export async function lockForStep(
  trx: Knex.Transaction,
  actor: Actor,
  versionId: number,
  lockVersion: number,
  action: VersionAction,
  event: VersionEvent,
): Promise<ProtocolVersion> {
  const v = await repo.findVersion(trx, versionId, { forUpdate: true });
  if (!v) throw new NotFoundError(`No protocol version with id ${versionId}.`);
  const editors = await repo.editorIds(trx, v);
  const why = denial(actor, action, { state: v.state, authorId: v.authorId, editorIds: editors });
  if (why) throw new ForbiddenError(why);
  const stateProblem = event === "edit" && v.state === "returned" ? null : refusal(v.state, event);
  if (stateProblem) throw new ConflictError(await explainState(trx, v, stateProblem));
  if (v.lockVersion !== lockVersion) throw new ConflictError(await staleMessage(trx, v, lockVersion));
  return v;
}

/** "Version 2 is already approved by Quinn Abara on …" when a signature explains the state; else the plain refusal. */
async function explainState(trx: Knex.Transaction, v: ProtocolVersion, fallback: string): Promise<string> {
  if (v.state === "approved" || v.state === "superseded" || v.state === "retired") {
    const [sig] = await repo.listSignatures(trx, [v.id]);
    if (sig) return `Version ${v.number} is already approved by ${sig.signerName} on ${formatDateTime(sig.signedAt)} (now ${STATE_LABELS[v.state].toLowerCase()}); nothing was changed.`;
  }
  if (v.state === "returned") {
    const comments = await repo.listComments(trx, v.id);
    const last = comments.filter((c) => c.kind === "return").at(-1);
    if (last) return `Version ${v.number} was already returned by ${last.authorName} on ${formatDateTime(last.createdAt)}; nothing was changed.`;
  }
  return fallback;
}

async function staleMessage(trx: Knex.Transaction, v: ProtocolVersion, loaded: number): Promise<string> {
  const last = await latestEventOf(trx, "protocol_version", v.id);
  const who = last ? ` The latest change: "${last.summary}" by ${last.actorEmail ?? "the system"} at ${formatDateTime(last.occurredAt)}.` : "";
  return `Version ${v.number} changed after you opened it (you loaded change ${loaded}; it is now at change ${v.lockVersion}).${who} Reload the page to see the current version; nothing was saved.`;
}
