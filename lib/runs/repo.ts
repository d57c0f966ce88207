import type { Knex } from "knex";
import { db } from "@/db/knex";
import { joinUser } from "@/lib/users/repo";

/** Database access for bench runs and their attachments (rows in, domain objects out; rules live in service.ts). */

type Conn = Knex | Knex.Transaction;

/** One attachment as the app sees it (the file itself is in the object store under the key `storagePath`). */
export interface Attachment {
  id: number;
  runId: number;
  fileName: string;
  mimeType: string;
  sizeBytes: number;
  sha256: string;
  storagePath: string;
  createdAt: Date;
}

/** One bench run record. SI units: S/m, Hz, V, osmol/kg; temperatures °C; minutes; recovery and purity as fractions. */
export interface BenchRun {
  id: number;
  versionId: number;
  technicianId: number;
  technicianName: string;
  bufferLot: string;
  measuredConductivity: number;
  measuredAtC: number;
  conductivity25: number;
  targetConductivity25: number;
  tolerance: number;
  conductivityAccepted: boolean;
  operatingTemperatureC: number;
  frequencyHz: number;
  voltageVpp: number;
  flowRateUlPerMin: number | null;
  /** Measured osmolality of the buffer, osmol/kg; null when not measured. */
  measuredOsmolality: number | null;
  /** Minutes the cells spent in the low-conductivity buffer; null when not noted. */
  minutesInBuffer: number | null;
  observedRecovery: number | null;
  observedPurity: number | null;
  countingMethod: string;
  deviations: string;
  notes: string;
  createdAt: Date;
  attachments: Attachment[];
}

/** What the service inserts. */
export type NewRun = Omit<BenchRun, "id" | "technicianName" | "createdAt" | "attachments">;

type Row = Record<string, unknown>;
const num = (v: unknown) => Number(v);
const maybeNum = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/** attachments row → Attachment. */
export function toAttachment(row: Row): Attachment {
  return {
    id: num(row.id),
    runId: num(row.run_id),
    fileName: String(row.file_name),
    mimeType: String(row.mime_type),
    sizeBytes: num(row.size_bytes),
    sha256: String(row.sha256),
    storagePath: String(row.storage_path),
    createdAt: new Date(row.created_at as string),
  };
}

/** bench_runs row (joined with users as technician_name) → BenchRun. */
export function toRun(row: Row, attachments: Attachment[] = []): BenchRun {
  return {
    id: num(row.id),
    versionId: num(row.version_id),
    technicianId: num(row.technician_id),
    technicianName: String(row.technician_name ?? ""),
    bufferLot: String(row.buffer_lot),
    measuredConductivity: num(row.measured_conductivity),
    measuredAtC: num(row.measured_at_c),
    conductivity25: num(row.conductivity_25),
    targetConductivity25: num(row.target_conductivity_25),
    tolerance: num(row.tolerance),
    conductivityAccepted: Boolean(row.conductivity_accepted),
    operatingTemperatureC: num(row.operating_temperature_c),
    frequencyHz: num(row.frequency_hz),
    voltageVpp: num(row.voltage_vpp),
    flowRateUlPerMin: maybeNum(row.flow_rate_ul_per_min),
    measuredOsmolality: maybeNum(row.measured_osmolality),
    minutesInBuffer: maybeNum(row.minutes_in_buffer),
    observedRecovery: maybeNum(row.observed_recovery),
    observedPurity: maybeNum(row.observed_purity),
    countingMethod: String(row.counting_method ?? ""),
    deviations: String(row.deviations ?? ""),
    notes: String(row.notes ?? ""),
    createdAt: new Date(row.created_at as string),
    attachments,
  };
}

/** Inserts a run row; returns its id. @example await insertRun(trx, run) */
export async function insertRun(trx: Conn, r: NewRun): Promise<number> {
  const [id] = await trx("bench_runs").insert({
    version_id: r.versionId,
    technician_id: r.technicianId,
    buffer_lot: r.bufferLot,
    measured_conductivity: r.measuredConductivity,
    measured_at_c: r.measuredAtC,
    conductivity_25: r.conductivity25,
    target_conductivity_25: r.targetConductivity25,
    tolerance: r.tolerance,
    conductivity_accepted: r.conductivityAccepted,
    operating_temperature_c: r.operatingTemperatureC,
    frequency_hz: r.frequencyHz,
    voltage_vpp: r.voltageVpp,
    flow_rate_ul_per_min: r.flowRateUlPerMin,
    measured_osmolality: r.measuredOsmolality,
    minutes_in_buffer: r.minutesInBuffer,
    observed_recovery: r.observedRecovery,
    observed_purity: r.observedPurity,
    counting_method: r.countingMethod,
    deviations: r.deviations,
    notes: r.notes,
  });
  return Number(id);
}

/** Inserts an attachment row; returns its id. */
export async function insertAttachment(trx: Conn, a: Omit<Attachment, "id" | "createdAt">): Promise<number> {
  const [id] = await trx("attachments").insert({
    run_id: a.runId,
    file_name: a.fileName,
    mime_type: a.mimeType,
    size_bytes: a.sizeBytes,
    sha256: a.sha256,
    storage_path: a.storagePath,
  });
  return Number(id);
}

/** bench_runs rows with the technician's name. */
const withTechnician = (conn: Conn) => joinUser(conn("bench_runs as r").select("r.*"), "r.technician_id", "u", { name: "technician_name" });

/**
 * Runs of a version, newest first, each with its attachments.
 * @example const runs = await listRunsForVersion(12);
 */
export async function listRunsForVersion(versionId: number, conn: Conn = db): Promise<BenchRun[]> {
  const rows: Row[] = await withTechnician(conn)
    .where("r.version_id", versionId)
    .orderBy("r.id", "desc");
  const ids = rows.map((r) => num(r.id));
  const files = ids.length ? (await conn("attachments").whereIn("run_id", ids).orderBy("id")).map(toAttachment) : [];
  return rows.map((r) => toRun(r, files.filter((f) => f.runId === num(r.id))));
}

/** One attachment with the version its run belongs to, or null. */
export async function findAttachment(id: number, conn: Conn = db): Promise<(Attachment & { versionId: number }) | null> {
  const row = await conn("attachments as a").join("bench_runs as r", "r.id", "a.run_id").where("a.id", id).first("a.*", "r.version_id");
  return row ? { ...toAttachment(row), versionId: num(row.version_id) } : null;
}

/**
 * Which of these object keys an attachment row names (for the orphan sweep).
 * @example await attachmentKeysAmong(["attachments/2026-12/a.png"]) // Set { "attachments/2026-12/a.png" }
 */
export async function attachmentKeysAmong(keys: string[], conn: Conn = db): Promise<Set<string>> {
  if (keys.length === 0) return new Set();
  const rows: { storage_path: string }[] = await conn("attachments").whereIn("storage_path", keys).select("storage_path");
  return new Set(rows.map((r) => r.storage_path));
}

/**
 * Attachments whose file is still named by a path under the old UPLOAD_DIR folder (not yet an object key).
 * @example (await legacyAttachments()).length // 0 after `npm run storage:migrate`
 */
export async function legacyAttachments(conn: Conn = db): Promise<Attachment[]> {
  const rows: Row[] = await conn("attachments").whereNot("storage_path", "like", "attachments/%").orderBy("id");
  return rows.map(toAttachment);
}

/**
 * Points an attachment at its object key, only if it still names the old path; returns whether it changed.
 * @example await moveAttachmentKey(3, "runs/7/1-ab.png", "attachments/2026-12/….png") // true
 */
export async function moveAttachmentKey(id: number, oldPath: string, key: string, conn: Conn = db): Promise<boolean> {
  return (await conn("attachments").where({ id, storage_path: oldPath }).update({ storage_path: key })) === 1;
}

/** How the runs of one version went (for the supervisor's dashboard). Purity as a fraction. */
export interface VersionRunStats {
  runCount: number;
  lastRunAt: Date | null;
  /** Runs whose measured buffer conductivity was outside the acceptance range. */
  readingsOutOfRange: number;
  meanObservedPurity: number | null;
}

/**
 * Run statistics per version id (versions without runs are absent).
 * @example (await runStatsByVersion([12])).get(12)?.runCount // 3
 */
export async function runStatsByVersion(versionIds: number[], conn: Conn = db): Promise<Map<number, VersionRunStats>> {
  if (versionIds.length === 0) return new Map();
  const rows: { version_id: number; n: number; last: string | null; purity: number | null; rejected: number | null }[] = await conn("bench_runs")
    .whereIn("version_id", versionIds)
    .groupBy("version_id")
    .select("version_id")
    .count({ n: "*" })
    .max({ last: "created_at" })
    .avg({ purity: "observed_purity" })
    .sum({ rejected: conn.raw("CASE WHEN conductivity_accepted THEN 0 ELSE 1 END") }) as never;
  return new Map(
    rows.map((s) => [
      num(s.version_id),
      { runCount: num(s.n ?? 0), lastRunAt: s.last ? new Date(s.last) : null, readingsOutOfRange: num(s.rejected ?? 0), meanObservedPurity: maybeNum(s.purity) },
    ]),
  );
}

/**
 * The latest runs across all versions, newest first, without attachments.
 * @example const runs = await listRecentRuns(10); runs[0].technicianName
 */
export async function listRecentRuns(limit: number, conn: Conn = db): Promise<BenchRun[]> {
  const rows: Row[] = await withTechnician(conn)
    .orderBy("r.created_at", "desc")
    .limit(limit);
  return rows.map((r) => toRun(r));
}
