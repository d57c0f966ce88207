import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { ConflictError, ForbiddenError, InputError, NotFoundError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { codePrefix, formatCode } from "./code";
import { protocolContentSchema, type ProtocolContent } from "./content";
import type { Actor } from "./guard";
import { lockForStep } from "./guard";
import { contentHash } from "./hash";
import { auditSnapshot, type Protocol, type ProtocolVersion } from "./mapper";
import { notifySubmitted } from "./notify";
import { authorDenial, newVersionDenial } from "./policy";
import * as repo from "./repo";
import { createProtocolSchema, draftDetailsSchema, submitSchema, updateDraftSchema } from "./schemas";

/** Authoring: create a protocol, start a version, edit a draft, submit it. Every change is one transaction with its audit rows. */

export type { Actor };

const isDuplicate = (err: unknown) => (err as { code?: string })?.code === "ER_DUP_ENTRY";

/**
 * Creates a protocol with version 1 as a draft holding `content`. The code is the prefix (given, or the title's
 * initials) with the next free number.
 * @example const { protocol, version } = await createProtocol(dana, { title: "Larkspur Fermentation QC", purpose: "…", content });
 *   // protocol.code === "LFQ-0001", version.state === "draft"
 */
export async function createProtocol(actor: Actor, raw: unknown): Promise<{ protocol: Protocol; version: ProtocolVersion }> {
  const why = authorDenial(actor.role);
  if (why) throw new ForbiddenError(why);
  const input = parseOrThrow(createProtocolSchema, raw);
  const prefix = codePrefix(input.title, input.codePrefix);
  for (let attempt = 0; ; attempt++) {
    try {
      return await db.transaction(async (trx) => {
        const code = formatCode(prefix, (await repo.highestCodeNumber(trx, prefix)) + 1);
        const protocolId = await repo.insertProtocol(trx, { code, title: input.title, purpose: input.purpose, createdBy: actor.id });
        const hash = contentHash(input.content);
        const versionId = await repo.insertVersion(trx, {
          protocolId,
          number: 1,
          content: input.content,
          engineVersion: input.content.plan.engineVersion,
          contentHash: hash,
          authorId: actor.id,
        });
        const version = (await repo.findVersion(trx, versionId))!;
        await recordAudit(trx, { actor, action: "protocol.create", entityType: "protocol", entityId: protocolId, summary: `Created protocol ${code} "${input.title}"`, after: { code, title: input.title, purpose: input.purpose } });
        await recordAudit(trx, { actor, action: "protocol_version.create", entityType: "protocol_version", entityId: versionId, summary: `${code} v1: draft created`, after: auditSnapshot(version) });
        return { protocol: (await repo.findProtocol(trx, protocolId))!, version };
      });
    } catch (err) {
      if (isDuplicate(err) && attempt < 4) continue;
      throw err;
    }
  }
}

/**
 * Starts version n+1 as a draft copy of the latest version. Refused while the latest version is still open.
 * @example const v2 = await newVersion(dana, protocolId); // v2.state === "draft", same content as v1
 */
export async function newVersion(actor: Actor, protocolId: number): Promise<ProtocolVersion> {
  try {
    return await db.transaction(async (trx) => {
      const protocol = await repo.findProtocol(trx, protocolId);
      if (!protocol) throw new NotFoundError(`No protocol with id ${protocolId}.`);
      const latest = await repo.latestVersion(trx, protocolId, { forUpdate: true });
      if (!latest) throw new NotFoundError(`${protocol.code} has no versions.`);
      const why = newVersionDenial(actor, latest.state);
      if (why) throw actor.role === "developer" ? new ConflictError(`${protocol.code} v${latest.number}: ${why}`) : new ForbiddenError(why);
      const id = await repo.insertVersion(trx, {
        protocolId,
        number: latest.number + 1,
        content: latest.rawContent,
        engineVersion: latest.engineVersion,
        contentHash: contentHash(latest.rawContent),
        authorId: actor.id,
      });
      const version = (await repo.findVersion(trx, id))!;
      await repo.touchProtocol(trx, protocolId);
      await recordAudit(trx, {
        actor,
        action: "protocol_version.create",
        entityType: "protocol_version",
        entityId: id,
        summary: `${protocol.code} v${version.number}: draft started as a copy of v${latest.number}`,
        after: { ...auditSnapshot(version), copiedFrom: latest.number },
      });
      return version;
    });
  } catch (err) {
    if (isDuplicate(err)) throw new ConflictError("Someone else started a new version of this protocol at the same moment; reload to see it.");
    throw err;
  }
}

/**
 * Replaces a draft's content, refusing a stale `lockVersion` (ConflictError, nothing saved). Editing a returned
 * version reopens it as a draft in the same transaction.
 * @example await updateDraft(dana, { versionId: 7, lockVersion: 3, content });
 */
export async function updateDraft(actor: Actor, raw: unknown): Promise<ProtocolVersion> {
  const input = parseOrThrow(updateDraftSchema, raw);
  return editContent(actor, input.versionId, input.lockVersion, () => input.content);
}

/**
 * Changes the bench handling details of a draft (form in lab units: %, million cells/mL, minutes).
 * @example await updateDraftDetails(dana, { versionId: 7, lockVersion: 3, washes: 2, resuspensionMillionsPerMl: 5, tolerancePercent: 10, maxMinutesInBuffer: 30, notes: "" });
 */
export async function updateDraftDetails(actor: Actor, raw: unknown): Promise<ProtocolVersion> {
  const d = parseOrThrow(draftDetailsSchema, raw);
  return editContent(actor, d.versionId, d.lockVersion, (c) => ({
    ...c,
    buffer: { ...c.buffer, tolerance: d.tolerancePercent / 100, maxMinutesInBuffer: d.maxMinutesInBuffer },
    cellPrep: { ...c.cellPrep, washes: d.washes, resuspensionCellsPerMl: d.resuspensionMillionsPerMl * 1e6, notes: d.notes },
  }));
}

async function editContent(actor: Actor, versionId: number, lockVersion: number, change: (c: ProtocolContent) => ProtocolContent): Promise<ProtocolVersion> {
  return db.transaction(async (trx) => {
    const before = await lockForStep(trx, actor, versionId, lockVersion, "edit", "edit");
    const protocol = (await repo.findProtocol(trx, before.protocolId))!;
    const content = parseOrThrow(protocolContentSchema, change(before.content));
    const hash = contentHash(content);
    await repo.updateVersion(trx, versionId, lockVersion, {
      state: "draft",
      content,
      contentHash: hash,
      engineVersion: content.plan.engineVersion,
      lastEditorId: actor.id,
    });
    const after = (await repo.findVersion(trx, versionId))!;
    if (before.state === "returned") {
      await recordAudit(trx, { actor, action: "protocol_version.reopen", entityType: "protocol_version", entityId: versionId, summary: `${protocol.code} v${before.number}: reopened as a draft after return`, before: auditSnapshot(before), after: { ...auditSnapshot(before), state: "draft" } });
    }
    await recordAudit(trx, {
      actor,
      action: "protocol_version.edit",
      entityType: "protocol_version",
      entityId: versionId,
      summary: hash === before.contentHash ? `${protocol.code} v${before.number}: saved without content changes` : `${protocol.code} v${before.number}: draft edited`,
      before: auditSnapshot(before),
      after: auditSnapshot(after),
    });
    return after;
  });
}

/**
 * The author submits a draft for QA review: content re-validated and re-hashed, state → in review, every active
 * reviewer e-mailed (outbox, same transaction).
 * @example await submitVersion(dana, { versionId: 7, lockVersion: 4 });
 */
export async function submitVersion(actor: Actor, raw: unknown): Promise<ProtocolVersion> {
  const input = parseOrThrow(submitSchema, raw);
  return db.transaction(async (trx) => {
    const before = await lockForStep(trx, actor, input.versionId, input.lockVersion, "submit", "submit");
    const parsed = protocolContentSchema.safeParse(before.rawContent);
    if (!parsed.success) {
      throw new InputError(parsed.error.issues.map((i) => ({ path: `content.${i.path.join(".")}`, message: i.message })), "The draft's content is incomplete; fix it before submitting.");
    }
    const protocol = (await repo.findProtocol(trx, before.protocolId))!;
    await repo.updateVersion(trx, before.id, before.lockVersion, { state: "in_review", submittedAt: await repo.dbNow(trx), contentHash: contentHash(before.rawContent) });
    const after = (await repo.findVersion(trx, before.id))!;
    await repo.touchProtocol(trx, protocol.id);
    await recordAudit(trx, { actor, action: "protocol_version.submit", entityType: "protocol_version", entityId: before.id, summary: `${protocol.code} v${before.number}: submitted for review`, before: auditSnapshot(before), after: auditSnapshot(after) });
    await notifySubmitted(trx, protocol, after, actor, after.lockVersion);
    return after;
  });
}
