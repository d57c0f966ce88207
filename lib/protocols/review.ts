import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { ConflictError, ForbiddenError, InputError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { checkOwnPassword } from "@/lib/auth/password-checks";
import type { Actor } from "./guard";
import { lockForStep } from "./guard";
import { checkIntegrity } from "./integrity";
import { auditSnapshot, type ProtocolVersion, type Signature } from "./mapper";
import { notifyApproved, notifyReturned } from "./notify";
import { denial } from "./policy";
import * as repo from "./repo";
import { approveSchema, retireSchema, returnSchema } from "./schemas";

/** QA decisions: return with a comment, approve with an electronic signature, retire. */

/**
 * A reviewer returns a version in review to its author with a comment (stored, audited, e-mailed to the author).
 * @example await returnVersion(quinn, { versionId: 7, lockVersion: 5, comment: "State the wash buffer." });
 */
export async function returnVersion(actor: Actor, raw: unknown): Promise<ProtocolVersion> {
  const input = parseOrThrow(returnSchema, raw);
  return db.transaction(async (trx) => {
    const before = await lockForStep(trx, actor, input.versionId, input.lockVersion, "return", "return");
    const protocol = (await repo.findProtocol(trx, before.protocolId))!;
    const commentId = await repo.insertComment(trx, { versionId: before.id, authorId: actor.id, body: input.comment, kind: "return" });
    await repo.updateVersion(trx, before.id, before.lockVersion, { state: "returned" });
    const after = (await repo.findVersion(trx, before.id))!;
    await repo.touchProtocol(trx, protocol.id);
    await recordAudit(trx, {
      actor,
      action: "protocol_version.return",
      entityType: "protocol_version",
      entityId: before.id,
      summary: `${protocol.code} v${before.number}: returned to the author`,
      before: auditSnapshot(before),
      after: { ...auditSnapshot(after), commentId, comment: input.comment },
    });
    await notifyReturned(trx, protocol, after, actor, input.comment, after.lockVersion);
    return after;
  });
}

/**
 * Electronic signature: the reviewer's password is checked again (under the attempt limits, audited when wrong), the signature (signer, role, meaning, time, content
 * hash) is stored, the version becomes approved, and the previously approved version of the protocol becomes
 * superseded — one transaction, with the audit rows and the sign-off e-mails (every supervisor and the author).
 * Two reviewers approving at once: the row lock serialises them and the second gets "already approved by …".
 * @example const { version, signature } = await approveVersion(quinn, { versionId: 7, lockVersion: 6, meaning: "Approved for bench use", password });
 */
export async function approveVersion(actor: Actor, raw: unknown): Promise<{ version: ProtocolVersion; signature: Signature; superseded: number[] }> {
  const input = parseOrThrow(approveSchema, raw);
  const early = denial(actor, "approve", { state: "in_review", authorId: -1, editorIds: [] });
  if (early) throw new ForbiddenError(early);
  if (!(await checkOwnPassword(actor, input.password, "signature", { type: "protocol_version", id: input.versionId }))) {
    throw new InputError([{ path: "password", message: "Password: this is not your current password; nothing was signed." }]);
  }
  return db.transaction(async (trx) => {
    const before = await lockForStep(trx, actor, input.versionId, input.lockVersion, "approve", "approve");
    const integrity = checkIntegrity(before.rawContent, before.contentHash, []);
    if (!integrity.ok) throw new ConflictError(`Version ${before.number} cannot be signed: ${integrity.problems.join(" ")}`);
    const protocol = (await repo.findProtocol(trx, before.protocolId))!;
    const at = await repo.dbNow(trx);
    const signatureId = await repo.insertSignature(trx, { versionId: before.id, signerId: actor.id, signerRole: actor.role, meaning: input.meaning, contentHash: integrity.computed, signedAt: at });
    const superseded: number[] = [];
    for (const old of await repo.approvedVersionsForUpdate(trx, protocol.id, before.id)) {
      await repo.updateVersion(trx, old.id, old.lockVersion, { state: "superseded", supersededAt: at });
      const now = (await repo.findVersion(trx, old.id))!;
      superseded.push(old.number);
      await recordAudit(trx, { actor, action: "protocol_version.supersede", entityType: "protocol_version", entityId: old.id, summary: `${protocol.code} v${old.number}: superseded by v${before.number}`, before: auditSnapshot(old), after: auditSnapshot(now) });
    }
    await repo.updateVersion(trx, before.id, before.lockVersion, { state: "approved", approvedAt: at });
    const after = (await repo.findVersion(trx, before.id))!;
    const signature = (await repo.listSignatures(trx, [before.id])).find((s) => s.id === signatureId)!;
    await repo.touchProtocol(trx, protocol.id);
    await recordAudit(trx, {
      actor,
      action: "protocol_version.approve",
      entityType: "protocol_version",
      entityId: before.id,
      summary: `${protocol.code} v${before.number}: signed off by ${actor.name} — ${input.meaning}`,
      before: auditSnapshot(before),
      after: { ...auditSnapshot(after), signatureId, meaning: input.meaning, signerRole: actor.role, supersedes: superseded },
    });
    await notifyApproved(trx, protocol, after, signature, superseded);
    return { version: after, signature, superseded };
  });
}

/**
 * A reviewer withdraws an approved version from bench use, with the reason (stored as a note).
 * @example await retireVersion(quinn, { versionId: 7, lockVersion: 7, reason: "Chip model discontinued." });
 */
export async function retireVersion(actor: Actor, raw: unknown): Promise<ProtocolVersion> {
  const input = parseOrThrow(retireSchema, raw);
  return db.transaction(async (trx) => {
    const before = await lockForStep(trx, actor, input.versionId, input.lockVersion, "retire", "retire");
    const protocol = (await repo.findProtocol(trx, before.protocolId))!;
    const commentId = await repo.insertComment(trx, { versionId: before.id, authorId: actor.id, body: `Retired: ${input.reason}`, kind: "note" });
    await repo.updateVersion(trx, before.id, before.lockVersion, { state: "retired" });
    const after = (await repo.findVersion(trx, before.id))!;
    await repo.touchProtocol(trx, protocol.id);
    await recordAudit(trx, { actor, action: "protocol_version.retire", entityType: "protocol_version", entityId: before.id, summary: `${protocol.code} v${before.number}: retired — ${input.reason}`, before: auditSnapshot(before), after: { ...auditSnapshot(after), commentId, reason: input.reason } });
    return after;
  });
}
