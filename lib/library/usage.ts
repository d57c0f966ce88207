import type { Knex } from "knex";
import { db } from "@/db/knex";
import { kindInfo, type LibraryKind } from "./kinds";

/**
 * Protocol version states in which a referenced item version must stay as it is: submitted for review, signed, or
 * signed and since replaced or retired. A draft or returned version may still change its references.
 */
export const LOCKING_STATES = ["in_review", "approved", "superseded", "retired"] as const;

/** A protocol version that refers to an item version. */
export interface ProtocolUse {
  protocolVersionId: number;
  protocolId: number;
  protocolCode: string | null;
  number: number;
  state: string;
  itemVersion: number;
}

async function protocolTablesExist(conn: Knex): Promise<{ versions: boolean; protocols: boolean }> {
  const versions = await conn.schema.hasTable("protocol_versions");
  return { versions, protocols: versions && (await conn.schema.hasTable("protocols")) };
}

/**
 * Protocol versions (any state) whose content refers to item `id` of `kind`, optionally only one item version.
 * Empty when the protocol tables do not exist yet.
 * @example await listProtocolUses("buffers", 3) // [{ protocolCode: "LFQ-001", number: 2, state: "approved", itemVersion: 1, … }]
 */
export async function listProtocolUses(kind: LibraryKind, id: number, version?: number, conn: Knex = db): Promise<ProtocolUse[]> {
  const tables = await protocolTablesExist(conn);
  if (!tables.versions) return [];
  const out: ProtocolUse[] = [];
  for (const path of kindInfo(kind).refPaths) {
    const idExpr = `CAST(JSON_VALUE(pv.content_json, '${path}.id') AS UNSIGNED)`;
    const versionExpr = `CAST(JSON_VALUE(pv.content_json, '${path}.version') AS UNSIGNED)`;
    const q = conn("protocol_versions as pv")
      .select("pv.id", "pv.protocol_id", "pv.number", "pv.state", conn.raw(`${versionExpr} as item_version`))
      .whereRaw(`${idExpr} = ?`, [id]);
    if (version !== undefined) q.whereRaw(`${versionExpr} = ?`, [version]);
    if (tables.protocols) q.leftJoin("protocols as p", "p.id", "pv.protocol_id").select("p.code");
    for (const r of await q)
      out.push({ protocolVersionId: Number(r.id), protocolId: Number(r.protocol_id), protocolCode: r.code ?? null, number: Number(r.number), state: String(r.state), itemVersion: Number(r.item_version) });
  }
  const seen = new Set<number>();
  return out.filter((u) => (seen.has(u.protocolVersionId) ? false : (seen.add(u.protocolVersionId), true))).sort((a, b) => a.protocolVersionId - b.protocolVersionId);
}

/**
 * Whether item version `version` of item `id` is referenced by a protocol version that is in review, approved,
 * superseded or retired (LOCKING_STATES). Such an item version cannot be corrected in place: an edit must become a
 * new item version. False when the protocol tables do not exist yet.
 * @example if (await isItemVersionInApprovedUse("populations", 4, 2)) throw new ConflictError("…");
 */
export async function isItemVersionInApprovedUse(kind: LibraryKind, id: number, version: number, conn: Knex = db): Promise<boolean> {
  const uses = await listProtocolUses(kind, id, version, conn);
  return uses.some((u) => (LOCKING_STATES as readonly string[]).includes(u.state));
}
