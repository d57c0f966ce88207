import type { Knex } from "knex";
import { versionsReferring, type ItemReference } from "@/lib/protocols/repo";
import { isLocking } from "@/lib/protocols/states";
import { kindInfo, type LibraryKind } from "./kinds";

/** A protocol version that refers to an item version. */
export type ProtocolUse = ItemReference;

/**
 * Protocol versions (any state) whose content refers to item `id` of `kind`, optionally only one item version.
 * Empty when the protocol tables do not exist yet.
 * @example await listProtocolUses("buffers", 3) // [{ protocolCode: "LFQ-001", number: 2, state: "approved", itemVersion: 1, … }]
 */
export async function listProtocolUses(kind: LibraryKind, id: number, version?: number, conn?: Knex): Promise<ProtocolUse[]> {
  const out = await versionsReferring(conn, kindInfo(kind).refPaths, id, version);
  const seen = new Set<number>();
  return out.filter((u) => (seen.has(u.protocolVersionId) ? false : (seen.add(u.protocolVersionId), true))).sort((a, b) => a.protocolVersionId - b.protocolVersionId);
}

/**
 * Whether item version `version` of item `id` is referenced by a protocol version that is in review, approved,
 * superseded or retired (LOCKING_STATES, lib/protocols/states.ts). Such an item version cannot be corrected in place: an edit must become a
 * new item version. False when the protocol tables do not exist yet.
 * @example if (await isItemVersionInApprovedUse("populations", 4, 2)) throw new ConflictError("…");
 */
export async function isItemVersionInApprovedUse(kind: LibraryKind, id: number, version: number, conn?: Knex): Promise<boolean> {
  const uses = await listProtocolUses(kind, id, version, conn);
  return uses.some((u) => isLocking(u.state));
}
