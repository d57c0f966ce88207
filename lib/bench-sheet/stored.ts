import { deleteQuietly, newObjectKey, putObject, readObject } from "@/lib/storage";
import { isBenchReady } from "@/lib/protocols/states";
import { buildBenchSheet } from "./layout";
import { renderInWorker } from "./pool";
import { countStoredSheets, findStoredSheet, insertStoredSheet, type StoredSheet } from "./stored-repo";
import type { PaperSize } from "@/templates/bench-sheet/layout";
import type { BenchSheetSource } from "./types";

/** Distinct (paper, volume) sheets kept per version; beyond this they are drawn on demand and not kept. */
export const MAX_STORED_SHEETS_PER_VERSION = 24;

/** A sheet ready to send: its bytes (absent when the caller already has them), and its SHA-256 when it is stored. */
export interface SheetFile {
  bytes: Uint8Array | null;
  sha256: string | null;
}

const inFlight = new Map<string, Promise<StoredSheet | null>>();

function issuedAt(source: BenchSheetSource): Date {
  const times = source.signatures.map((s) => new Date(s.signedAt).getTime()).filter(Number.isFinite);
  return new Date(times.length ? Math.max(...times) : 0);
}

async function makeStoredSheet(source: BenchSheetSource, paper: PaperSize, volumeMl: number): Promise<StoredSheet | null> {
  if ((await countStoredSheets(source.version.id)) >= MAX_STORED_SHEETS_PER_VERSION) return null;
  const layout = buildBenchSheet(source, { paper, volumeMl, printedAt: issuedAt(source), issued: true });
  const pdf = await renderInWorker(layout);
  const obj = await putObject(newObjectKey("bench-sheets/", "pdf"), pdf, "application/pdf");
  const row = { versionId: source.version.id, paper, volumeMl, contentHash: source.version.contentHash, objectKey: obj.key, sha256: obj.sha256, sizeBytes: obj.size };
  let recorded = false;
  try {
    recorded = await insertStoredSheet(row);
  } finally {
    if (!recorded) await deleteQuietly([obj.key]);
  }
  return recorded ? { id: 0, ...row } : findStoredSheet(source.version.id, paper, volumeMl);
}

/**
 * The bench sheet for a version. A version that is approved and intact (signed, immutable) gets one stored PDF per
 * paper size and volume: made once on a worker thread, kept in the object store, and served from there on (SHA-256
 * checked) with its hash as ETag; `knownSha256` equal to it skips reading the bytes (for If-None-Match → 304).
 * Any other version is drawn on demand on a worker thread, marked NOT FOR BENCH USE, with the printer's name.
 * @example const { bytes, sha256 } = await benchSheetFile(source, { paper: "a4", volumeMl: 250, printedBy: "Tomas" });
 */
export async function benchSheetFile(
  source: BenchSheetSource,
  options: { paper: PaperSize; volumeMl: number; printedBy: string; knownSha256?: string | null },
): Promise<SheetFile> {
  const { paper, volumeMl } = options;
  if (isBenchReady(source.version, source.signatures, source.integrityProblems)) {
    let sheet = await findStoredSheet(source.version.id, paper, volumeMl);
    if (!sheet) {
      const flightKey = `${source.version.id}|${paper}|${volumeMl}`;
      let flight = inFlight.get(flightKey);
      if (!flight) {
        flight = makeStoredSheet(source, paper, volumeMl).finally(() => inFlight.delete(flightKey));
        inFlight.set(flightKey, flight);
      }
      sheet = await flight;
    }
    if (sheet && sheet.contentHash === source.version.contentHash) {
      if (options.knownSha256 === sheet.sha256) return { bytes: null, sha256: sheet.sha256 };
      return { bytes: (await readObject(sheet.objectKey, sheet.sha256)).bytes, sha256: sheet.sha256 };
    }
  }
  const layout = buildBenchSheet(source, { paper, volumeMl, printedAt: new Date(), printedBy: options.printedBy });
  return { bytes: await renderInWorker(layout), sha256: null };
}
