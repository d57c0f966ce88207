import bcrypt from "bcryptjs";
import type { Knex } from "knex";
import { protocolContentSchema, type ProtocolContent } from "@/lib/protocols/content";
import { contentHash } from "@/lib/protocols/hash";
import type { BenchSheetSource } from "@/lib/bench-sheet/types";
import type { VersionState } from "@/lib/protocols/states";

/**
 * A complete, valid protocol version for bench-sheet and run-record tests. Demo data: every number is invented
 * (plausible for live vs dead lymphocyte-like cells in a sucrose buffer), none taken from a paper.
 */

const spread = (mean: number, cv = 0.1) => ({ mean, cv, distribution: "normal" as const });

const lymphocyte = (membraneConductance: number, cytoplasm: number) => ({
  model: "single-shell" as const,
  radius: spread(3.6e-6, 0.08),
  interior: { permittivity: spread(60), conductivity: spread(cytoplasm) },
  membrane: { thickness: 7e-9, capacitance: spread(0.011), conductance: spread(membraneConductance, 0.3) },
});

/** The fixture's frozen content (invented demo values). */
export const BENCH_CONTENT: ProtocolContent = protocolContentSchema.parse({
  populations: {
    target: { name: "Live lymphocytes", spec: lymphocyte(50, 0.5) },
    other: { name: "Dead lymphocytes", spec: lymphocyte(5000, 0.05) },
  },
  buffer: {
    name: "Sucrose-glucose DEP buffer, 100 µS/cm",
    recipe: {
      sucrosePercentWV: 8.5,
      glucosePercentWV: 0.3,
      additions: [
        { label: "PBS 10× stock", kind: "stock", perLitre: 0.8 },
        { label: "Potassium chloride", kind: "solid", perLitre: 0.18 },
      ],
      conductivity25: 0.0101,
      osmolality: 292,
    },
    targetConductivity25: 0.01,
    tolerance: 0.1,
    osmolality: 292,
    maxMinutesInBuffer: 45,
  },
  device: {
    name: "IDE chip, 50 µm fingers",
    geometry: "interdigitated",
    dimensions: { width: 50e-6, gap: 50e-6, height: 50e-6 },
    gradientFactor: 2.1e13,
    gradientSource: "interdigitated preset",
    maxVoltageVpp: 20,
  },
  sortDesign: "capture by positive DEP",
  inputMix: { targetFraction: 0.6 },
  limits: { deltaT: 2, transmembrane: 0.5 },
  cellPrep: { washes: 2, resuspensionCellsPerMl: 2e6, notes: "Keep the tube on ice between washes." },
  selection: {
    frequency: 350000,
    band: { low: 180000, high: 700000 },
    conductivity: 0.01,
    voltageVrms: 5,
    voltageVpp: 14.14,
    waveform: "sine",
    flowRateUlPerMin: 2.5,
    temperatureC: 22,
    predicted: { recovery: 0.91, purity: 0.95, deltaT: 0.6 },
    behaviour: { target: "positive DEP: held at the electrode edges", other: "negative DEP: carried out with the flow" },
    reK: { target: 0.62, other: -0.41 },
    rank: 1,
    score: 0.83,
    warnings: [
      { code: "aceo", severity: "caution", message: "AC electro-osmosis possible on the electrodes below 500 kHz.", value: 350000, limit: 500000, unit: "Hz", advice: "Watch for streaming near the electrode edges." },
    ],
  },
  plan: { engineVersion: "fixture-1", seed: 42, request: {}, result: {} },
});

/** The fixture content's hash (SHA-256 of its canonical JSON, as the lifecycle computes it). */
export const BENCH_CONTENT_HASH = contentHash(BENCH_CONTENT);

/**
 * A bench-sheet source built from the fixture without a database.
 * @example buildBenchSheet(fixtureSource("draft"), options)
 */
export function fixtureSource(state: VersionState = "approved", signed = state === "approved"): BenchSheetSource {
  return {
    protocol: { id: 1, code: "QH-LYM-01", title: "Live/dead lymphocyte clean-up", purpose: "Remove dead cells before expansion." },
    version: { id: 11, number: 3, state, contentHash: BENCH_CONTENT_HASH, engineVersion: "fixture-1" },
    signatures: signed
      ? [{ signerName: "Quinn Reviewer", signerRole: "reviewer", meaning: "Approved for bench use", signedAt: new Date("2026-12-01T14:03:00Z"), contentHash: BENCH_CONTENT_HASH }]
      : [],
    content: BENCH_CONTENT,
  };
}

async function userId(conn: Knex, email: string, name: string, role: string): Promise<number> {
  const found = await conn("users").where({ email }).first("id");
  if (found) return Number(found.id);
  const [id] = await conn("users").insert({ email, name, role, password_hash: await bcrypt.hash("sievewright-demo", 4), active: true });
  return Number(id);
}

/** What insertBenchVersion created. */
export interface InsertedVersion {
  protocolId: number;
  versionId: number;
  number: number;
  code: string;
}

/**
 * Inserts a protocol (when its code is new) and one version of the fixture content in `state`, with a reviewer's
 * signature when approved. Creates the demo developer and reviewer when missing.
 * @example await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" })
 */
export async function insertBenchVersion(conn: Knex, opts: { code: string; state: VersionState; number?: number; title?: string }): Promise<InsertedVersion> {
  const author = await userId(conn, "dana.dev@example.test", "Dana Developer", "developer");
  const reviewer = await userId(conn, "quinn.qa@example.test", "Quinn Reviewer", "reviewer");
  const existing = await conn("protocols").where({ code: opts.code }).first("id");
  const protocolId = existing
    ? Number(existing.id)
    : Number((await conn("protocols").insert({ code: opts.code, title: opts.title ?? "Live/dead lymphocyte clean-up", purpose: "Remove dead cells before expansion.", created_by: author }))[0]);
  const last = await conn("protocol_versions").where({ protocol_id: protocolId }).max({ n: "number" }).first();
  const number = opts.number ?? Number(last?.n ?? 0) + 1;
  const [versionId] = await conn("protocol_versions").insert({
    protocol_id: protocolId,
    number,
    state: opts.state,
    content_json: JSON.stringify(BENCH_CONTENT),
    engine_version: BENCH_CONTENT.plan.engineVersion,
    content_hash: BENCH_CONTENT_HASH,
    author_id: author,
    last_editor_id: author,
    approved_at: opts.state === "approved" ? conn.fn.now(3) : null,
  });
  if (opts.state === "approved" || opts.state === "superseded") {
    await conn("signatures").insert({ version_id: versionId, signer_id: reviewer, signer_role: "reviewer", meaning: "Approved for bench use", content_hash: BENCH_CONTENT_HASH });
  }
  return { protocolId, versionId: Number(versionId), number, code: opts.code };
}
