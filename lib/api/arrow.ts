/**
 * Apache Arrow IPC (streaming format) for sweep results: the compact alternative to JSON on POST /api/v1/sweeps,
 * chosen with `Accept: application/vnd.apache.arrow.stream`. One record batch, one row per grid point, row-major by
 * conductivity (the same order as the JSON `re` arrays): columns `conductivity` (S/m), `frequency` (Hz) and one
 * float64 column `re:<particle id>` per particle (Re[K], dimensionless). Schema metadata carries the units, the
 * layout and the engine version. pandas: `pyarrow.ipc.open_stream(body).read_pandas()`.
 */
import { Schema, Table, tableFromArrays, tableToIPC } from "apache-arrow";
import { ENGINE_VERSION, evaluateSweep, parseOrThrow, sweepRequestSchema, type SweepRequest, type SweepResult } from "@/lib/dielectric";

/** The media type of the Arrow IPC streaming format. */
export const ARROW_STREAM = "application/vnd.apache.arrow.stream";

/**
 * True when the Accept header asks for Arrow (and ranks it at least as high as JSON).
 * @example wantsArrow(new Request("http://x", { headers: { accept: "application/vnd.apache.arrow.stream" } })) // true
 */
export function wantsArrow(req: Request): boolean {
  const accept = req.headers.get("accept") ?? "";
  let arrowQ = 0;
  let jsonQ = 0;
  for (const part of accept.split(",")) {
    const [type, ...params] = part.trim().toLowerCase().split(";");
    const q = Number(params.map((p) => p.trim()).find((p) => p.startsWith("q="))?.slice(2) ?? 1);
    if (type === ARROW_STREAM) arrowQ = Math.max(arrowQ, Number.isFinite(q) ? q : 0);
    if (type === "application/json") jsonQ = Math.max(jsonQ, Number.isFinite(q) ? q : 0);
  }
  return arrowQ > 0 && arrowQ >= jsonQ;
}

/**
 * Encodes a sweep result as one Arrow IPC stream (bytes).
 * @example sweepToArrow(evaluateSweep(req)).byteLength // ≈ 8 × points × (2 + particles) + a few hundred bytes
 */
export function sweepToArrow(result: SweepResult): Uint8Array {
  const nf = result.frequencies.length;
  const nc = result.conductivities.length;
  const conductivity = new Float64Array(nf * nc);
  const frequency = new Float64Array(nf * nc);
  for (let i = 0; i < nc; i++) {
    conductivity.fill(result.conductivities[i], i * nf, (i + 1) * nf);
    frequency.set(result.frequencies, i * nf);
  }
  const columns: Record<string, Float64Array> = { conductivity, frequency };
  for (const p of result.particles) columns[`re:${p.id}`] = p.re;
  const table = tableFromArrays(columns);
  const metadata = new Map([
    ["sievewright.layout", "one row per grid point, row-major by conductivity"],
    ["sievewright.units", JSON.stringify({ conductivity: "S/m", frequency: "Hz", "re:*": "1 (Re[K], dimensionless)" })],
    ["sievewright.shape", JSON.stringify({ conductivities: nc, frequencies: nf, particles: result.particles.map((p) => p.id) })],
    ["sievewright.engine_version", ENGINE_VERSION],
  ]);
  return tableToIPC(new Table(new Schema(table.schema.fields, metadata), table.batches), "stream");
}

/**
 * Validates a sweep request body, evaluates it and encodes it as Arrow. Throws EngineValidationError (→ 400) on a bad body.
 * @example computeSweepArrow(body) // Uint8Array of an Arrow IPC stream
 */
export function computeSweepArrow(body: unknown): Uint8Array {
  const req = parseOrThrow(sweepRequestSchema, body) as SweepRequest;
  return sweepToArrow(evaluateSweep(req));
}
