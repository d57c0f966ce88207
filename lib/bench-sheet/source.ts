import type { Role } from "@/lib/auth/roles";
import type { Protocol, ProtocolVersion, Signature } from "@/lib/protocols/mapper";
import type { Integrity } from "@/lib/protocols/integrity";
import { readVersionById, readVersionByNumber } from "@/lib/protocols/queries";
import type { BenchSheetSource } from "./types";

type Viewer = { id: number; role: Role };

function toSource(read: { protocol: Protocol; version: ProtocolVersion; signatures: Signature[]; integrity: Integrity }): BenchSheetSource {
  const { protocol, version, signatures, integrity } = read;
  return {
    protocol: { id: protocol.id, code: protocol.code, title: protocol.title, purpose: protocol.purpose },
    version: { id: version.id, number: version.number, state: version.state, contentHash: version.contentHash, engineVersion: version.engineVersion },
    signatures: signatures.map((s) => ({ signerName: s.signerName, signerRole: s.signerRole, meaning: s.meaning, signedAt: s.signedAt, contentHash: s.contentHash })),
    content: version.content,
    integrityProblems: integrity.problems,
  };
}

/**
 * Loads what a bench sheet is built from, by protocol id and version number, with the lifecycle's visibility rules
 * (a technician gets NotFoundError for anything but an approved version) and its hash check.
 * @example const source = await loadSheetSourceByNumber(user, 3, 2);
 */
export async function loadSheetSourceByNumber(viewer: Viewer, protocolId: number, number: number): Promise<BenchSheetSource> {
  return toSource(await readVersionByNumber(viewer, protocolId, number));
}

/**
 * The same by version id (the bench screens address versions by id).
 * @example const source = await loadSheetSourceById(user, 12);
 */
export async function loadSheetSourceById(viewer: Viewer, versionId: number): Promise<BenchSheetSource> {
  return toSource(await readVersionById(viewer, versionId));
}
