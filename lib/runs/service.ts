import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import type { Role } from "@/lib/auth/roles";
import { checkConductivity } from "@/lib/bench-sheet/acceptance";
import { ConflictError, ForbiddenError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { readVersionById } from "@/lib/protocols/queries";
import { lockVersionState } from "@/lib/protocols/repo";
import { deleteQuietly } from "@/lib/storage";
import { toSI } from "@/lib/units/lab";
import { checkFiles, storeRunFiles, type UploadFile } from "./attachments";
import { insertAttachment, insertRun, listRunsForVersion, type BenchRun, type NewRun } from "./repo";
import { recordRunSchema, type RecordRun } from "./schemas";

/** Who records: enough of a user for the rules and the audit trail. */
export interface RunActor {
  id: number;
  email: string;
  role: Role;
}

/**
 * Converts the form's lab units to the stored SI record and runs the acceptance check (compensated to 25 °C).
 * Osmolality is stored in osmol/kg (SI), frequency in Hz.
 * @example toNewRun(input, 7, { targetConductivity25: 0.01, tolerance: 0.1 }).measuredConductivity // 0.0105 for 105 µS/cm
 */
export function toNewRun(input: RecordRun, technicianId: number, buffer: { targetConductivity25: number; tolerance: number }): NewRun {
  const measured = input.conductivityUsPerCm * 1e-4;
  const check = checkConductivity(measured, input.measuredAtC, buffer.targetConductivity25, buffer.tolerance);
  return {
    versionId: input.versionId,
    technicianId,
    bufferLot: input.bufferLot,
    measuredConductivity: measured,
    measuredAtC: input.measuredAtC,
    conductivity25: check.compensated25,
    targetConductivity25: buffer.targetConductivity25,
    tolerance: buffer.tolerance,
    conductivityAccepted: check.accepted,
    operatingTemperatureC: input.operatingTemperatureC,
    frequencyHz: input.frequencyHz,
    voltageVpp: input.voltageVpp,
    flowRateUlPerMin: input.flowRateUlPerMin ?? null,
    measuredOsmolality: input.osmolalityMOsmPerKg === undefined ? null : toSI("mOsm_kg", input.osmolalityMOsmPerKg),
    minutesInBuffer: input.minutesInBuffer ?? null,
    observedRecovery: input.recoveryPercent === undefined ? null : input.recoveryPercent / 100,
    observedPurity: input.purityPercent === undefined ? null : input.purityPercent / 100,
    countingMethod: input.countingMethod,
    deviations: input.deviations,
    notes: input.notes,
  };
}

/**
 * Records a bench run with its attachments for an approved, current version, by a technician. Everything is checked
 * first; the files go to the object store, then the row, the attachment rows and the audit event are saved in one
 * transaction. If that fails the stored objects are deleted again (or swept later), so no record lacks its files and
 * no file outlives its record; a store that is down gives StorageUnavailableError (503) with nothing saved.
 * @example const run = await recordRun(tomas, { versionId: 12, bufferLot: "B-0412", … }, [{ name: "gate.png", bytes }]);
 */
export async function recordRun(actor: RunActor, raw: unknown, files: UploadFile[] = []): Promise<BenchRun> {
  if (actor.role !== "technician") throw new ForbiddenError("Only a technician records bench runs.");
  const input = parseOrThrow(recordRunSchema, raw);
  const { version, protocol, integrity } = await readVersionById(actor, input.versionId);
  if (version.state !== "approved") throw new ConflictError(`Version ${version.number} of ${protocol.code} is ${version.state.replace("_", " ")}: runs are recorded against the approved, current version only.`);
  if (!integrity.ok) throw new ConflictError(`Version ${version.number} of ${protocol.code} does not match what was signed (${integrity.problems[0]}). Do not use it; tell QA.`);
  const checked = checkFiles(files);
  const run = toNewRun(input, actor.id, version.content.buffer);
  const stored = await storeRunFiles(checked);
  let runId = 0;
  let recorded = false;
  try {
    await db.transaction(async (trx) => {
      if ((await lockVersionState(trx, version.id)) !== "approved") throw new ConflictError(`Version ${version.number} of ${protocol.code} stopped being current while you entered the run; nothing was saved.`);
      runId = await insertRun(trx, run);
      for (const [i, f] of checked.entries()) {
        await insertAttachment(trx, { runId, fileName: f.name.slice(0, 255), mimeType: f.mimeType, sizeBytes: f.bytes.length, sha256: f.sha256, storagePath: stored[i].key });
      }
      await recordAudit(trx, {
        actor,
        action: "run.record",
        entityType: "bench_run",
        entityId: runId,
        summary: `Recorded a bench run of ${protocol.code} v${version.number}: conductivity ${run.conductivityAccepted ? "within" : "OUTSIDE"} the acceptance range, ${checked.length} attachment(s).`,
        after: { versionId: version.id, conductivity25: run.conductivity25, accepted: run.conductivityAccepted, attachments: checked.map((f) => f.sha256) },
      });
    });
    recorded = true;
  } finally {
    if (!recorded) await deleteQuietly(stored.map((o) => o.key));
  }
  const runs = await listRunsForVersion(version.id);
  return runs.find((r) => r.id === runId)!;
}
