/**
 * zod schemas of the engine's requests, and the translation of zod's issues into `EngineValidationError`
 * messages a scientist can act on (field, bad value, allowed range).
 */
import { z } from "zod";
import { EngineValidationError, type ValidationIssue } from "./errors";
import { LIMITS } from "./limits";
import type { SpectraRequest, SweepRequest } from "./types";
import { tidy } from "@/lib/units/number";

/** Short readable form of any input value for error messages. Example: `describeValue(-5e-6)` → "-5e-6". */
export function describeValue(v: unknown): string {
  if (v === undefined) return "nothing";
  if (typeof v === "number") {
    if (Number.isNaN(v)) return "NaN";
    if (!Number.isFinite(v)) return v > 0 ? "Infinity" : "-Infinity";
    return String(tidy(v, 6));
  }
  if (typeof v === "string") return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
  if (Array.isArray(v)) return `a list of ${v.length}`;
  if (v === null) return "null";
  return typeof v;
}

interface QuantitySpec {
  /** What the number is, e.g. "outer radius (m)". */
  what: string;
  /** Allowed range in words, e.g. "between 1 nm and 1 mm (1e-9 to 1e-3 m)". */
  range: string;
  min: number;
  max: number;
  /** When true the minimum itself is not allowed. */
  exclusiveMin?: boolean;
  integer?: boolean;
}

/**
 * A finite number schema whose every failure says what the number is, what was given and what is allowed.
 * @example quantity({ what: "outer radius (m)", range: "between 1e-9 and 1e-3 m", min: 1e-9, max: 1e-3 })
 */
export function quantity(spec: QuantitySpec) {
  const msg = (iss: { input?: unknown }) => `${spec.what} must be ${spec.range} (got ${describeValue(iss.input)})`;
  let s = spec.integer ? z.number({ error: msg }).int({ error: msg }) : z.number({ error: msg });
  s = spec.exclusiveMin ? s.gt(spec.min, { error: msg }) : s.gte(spec.min, { error: msg });
  return s.lte(spec.max, { error: msg });
}

const frequency = (what: string) =>
  quantity({ what, range: "from 1 Hz to 10 GHz (1 to 1e10 Hz)", min: LIMITS.minFrequency, max: LIMITS.maxFrequency });

const relativePermittivity = (what: string) =>
  quantity({ what: `${what} relative permittivity`, range: "at least 1 (vacuum) and at most 1e6", min: LIMITS.minPermittivity, max: LIMITS.maxPermittivity });

const particleConductivity = (what: string) =>
  quantity({ what: `${what} conductivity (S/m)`, range: "zero or positive, at most 1e8 S/m", min: 0, max: LIMITS.maxParticleConductivity });

/** Medium conductivity in S/m: must be positive (1e-8 … 100 S/m). */
export const mediumConductivitySchema = quantity({
  what: "medium conductivity (S/m)",
  range: "greater than zero, between 1e-8 S/m (0.1 µS/cm) and 100 S/m",
  min: LIMITS.minMediumConductivity,
  max: LIMITS.maxMediumConductivity,
});

/** Medium relative permittivity (1 … 1e6; water is about 78). */
export const mediumPermittivitySchema = relativePermittivity("medium");

const materialSchema = (what: string) =>
  z.object({ permittivity: relativePermittivity(what), conductivity: particleConductivity(what) }, {
    error: (iss) => `${what} must be an object { permittivity, conductivity } (got ${describeValue(iss.input)})`,
  });

const thickness = quantity({ what: "shell thickness (m)", range: "at least 0.1 nm and at most 1 mm (1e-10 to 1e-3 m)", min: LIMITS.minShellThickness, max: LIMITS.maxRadius });

const shellFormsText = "a shell is given either as { thickness, permittivity, conductivity } or, for a thin membrane, as { thickness, capacitance, conductance }, not a mix";

const bulkShellSchema = z.strictObject(
  { thickness, permittivity: relativePermittivity("shell"), conductivity: particleConductivity("shell") },
  { error: (iss) => (iss.code === "unrecognized_keys" ? `unexpected field(s) ${(iss as { keys?: string[] }).keys?.join(", ")}: ${shellFormsText}` : `${shellFormsText} (got ${describeValue(iss.input)})`) },
);

const membraneShellSchema = z.strictObject(
  {
    thickness,
    capacitance: quantity({ what: "membrane specific capacitance (F/m²)", range: "greater than zero and at most 1 F/m² (100 µF/cm²); cell membranes are about 0.01 F/m²", min: 0, max: LIMITS.maxCapacitance, exclusiveMin: true }),
    conductance: quantity({ what: "membrane specific conductance (S/m²)", range: "zero or positive, at most 1e9 S/m²", min: 0, max: LIMITS.maxConductance }),
  },
  { error: (iss) => (iss.code === "unrecognized_keys" ? `unexpected field(s) ${(iss as { keys?: string[] }).keys?.join(", ")}: ${shellFormsText}` : `${shellFormsText} (got ${describeValue(iss.input)})`) },
);

/** One shell: bulk form or thin-membrane form. */
export const shellSchema = z.union([bulkShellSchema, membraneShellSchema]);

/** A particle: id, outer radius (m), core material and shells outermost first; shells must leave a core. */
export const particleSchema = z
  .object({
    id: z.string({ error: (iss) => `particle id must be text (got ${describeValue(iss.input)})` }).min(1, { error: "particle id must not be empty" }).max(200, { error: "particle id must be at most 200 characters" }),
    radius: quantity({ what: "outer radius (m)", range: "between 1 nm and 1 mm (1e-9 to 1e-3 m)", min: LIMITS.minRadius, max: LIMITS.maxRadius }),
    core: materialSchema("core"),
    shells: z.array(shellSchema, { error: (iss) => `shells must be a list (empty for a homogeneous sphere) (got ${describeValue(iss.input)})` })
      .max(LIMITS.maxShells, { error: (iss) => `a particle may have at most ${LIMITS.maxShells} shells (got ${describeValue(iss.input)})` }),
  })
  .superRefine((p, ctx) => {
    const total = p.shells.reduce((s, sh) => s + sh.thickness, 0);
    if (!(total < p.radius)) {
      ctx.addIssue({
        code: "custom",
        path: ["shells"],
        message: `the shells add up to ${describeValue(total)} m, which is not less than the outer radius ${describeValue(p.radius)} m; the core must keep a positive radius`,
      });
    }
  });

const gridSchema = (what: string, value: ReturnType<typeof quantity>, maxPoints: number, unitHint: string) =>
  z
    .object({
      start: value,
      stop: value,
      points: quantity({ what: `number of ${what} points`, range: `a whole number from 1 to ${maxPoints} (the cap for this request)`, min: 1, max: maxPoints, integer: true }),
    }, { error: (iss) => `${what} must be { start, stop, points } (${unitHint}, log-spaced) (got ${describeValue(iss.input)})` })
    .superRefine((g, ctx) => {
      if (g.points > 1 && !(g.stop > g.start)) {
        ctx.addIssue({ code: "custom", path: ["stop"], message: `${what} stop (${describeValue(g.stop)}) must be greater than start (${describeValue(g.start)}) when points > 1` });
      }
      if (g.points === 1 && g.stop !== g.start) {
        ctx.addIssue({ code: "custom", path: ["stop"], message: `${what} with a single point must have stop equal to start (got start ${describeValue(g.start)}, stop ${describeValue(g.stop)})` });
      }
    });

const particlesSchema = z
  .array(particleSchema, { error: (iss) => `particles must be a list (got ${describeValue(iss.input)})` })
  .min(1, { error: "give at least one particle" })
  .max(LIMITS.maxParticles, { error: (iss) => `at most ${LIMITS.maxParticles} particles per request (got ${describeValue(iss.input)})` })
  .superRefine((ps, ctx) => {
    const seen = new Set<string>();
    ps.forEach((p, i) => {
      if (seen.has(p.id)) ctx.addIssue({ code: "custom", path: [i, "id"], message: `particle id ${JSON.stringify(p.id)} is used twice; ids must be unique` });
      seen.add(p.id);
    });
  });

/** Frequency grid for spectra (Hz). */
export const spectraFrequencyGridSchema = gridSchema("frequency", frequency("frequency (Hz)"), LIMITS.maxSpectraFrequencies, "Hz");

/** Request schema of `evaluateSpectra`. */
export const spectraRequestSchema = z.object({
  medium: z.object({ conductivity: mediumConductivitySchema, permittivity: mediumPermittivitySchema }, {
    error: (iss) => `medium must be { conductivity (S/m), permittivity (relative) } (got ${describeValue(iss.input)})`,
  }),
  frequencies: z.union([
    z.array(frequency("frequency (Hz)"), { error: (iss) => `frequencies must be a list of Hz values or { start, stop, points } (got ${describeValue(iss.input)})` })
      .min(1, { error: "give at least one frequency" })
      .max(LIMITS.maxSpectraFrequencies, { error: (iss) => `at most ${LIMITS.maxSpectraFrequencies} frequencies per spectrum (got ${describeValue(iss.input)})` }),
    spectraFrequencyGridSchema,
  ]),
  particles: particlesSchema,
  crossoverRange: z
    .object({ start: frequency("crossover search start (Hz)"), stop: frequency("crossover search stop (Hz)") }, {
      error: (iss) => `crossoverRange must be { start, stop } in Hz (got ${describeValue(iss.input)})`,
    })
    .superRefine((r, ctx) => {
      if (!(r.stop > r.start)) ctx.addIssue({ code: "custom", path: ["stop"], message: `crossover search stop (${describeValue(r.stop)} Hz) must be greater than start (${describeValue(r.start)} Hz)` });
    })
    .optional(),
});

/** Request schema of `evaluateSweep`; the grid may hold at most `LIMITS.maxSweepPoints` points per particle. */
export const sweepRequestSchema = z
  .object({
    mediumPermittivity: mediumPermittivitySchema,
    frequencies: gridSchema("frequency", frequency("frequency (Hz)"), LIMITS.maxSweepFrequencies, "Hz"),
    conductivities: gridSchema("conductivity", mediumConductivitySchema, LIMITS.maxSweepConductivities, "S/m"),
    particles: particlesSchema,
  })
  .superRefine((r, ctx) => {
    const n = r.frequencies.points * r.conductivities.points;
    if (n > LIMITS.maxSweepPoints) {
      ctx.addIssue({
        code: "custom",
        path: ["frequencies", "points"],
        message: `the sweep grid has ${r.frequencies.points} frequencies × ${r.conductivities.points} conductivities = ${n} points; the cap is ${LIMITS.maxSweepPoints} points per particle`,
      });
    }
  });

/** Formats a zod path as text. Example: `formatPath(["particles", 0, "shells", 1])` → "particles[0].shells[1]". */
export function formatPath(path: ReadonlyArray<PropertyKey>): string {
  let out = "";
  for (const k of path) {
    if (typeof k === "number") out += `[${k}]`;
    else out += out ? `.${String(k)}` : String(k);
  }
  return out;
}

type RawIssue = { code: string; path: ReadonlyArray<PropertyKey>; message: string; errors?: RawIssue[][] };

function flatten(issue: RawIssue, prefix: ReadonlyArray<PropertyKey>, out: ValidationIssue[]): void {
  const path = [...prefix, ...issue.path];
  if (issue.code === "invalid_union" && issue.errors && issue.errors.length > 0) {
    const rootTypeMiss = (branch: RawIssue[]) => branch.some((b) => b.path.length === 0 && b.code === "invalid_type");
    const ranked = [...issue.errors].sort((a, b) => Number(rootTypeMiss(a)) - Number(rootTypeMiss(b)) || a.length - b.length);
    const best = ranked[0];
    if (rootTypeMiss(best)) {
      out.push({ path: formatPath(path), message: best.find((b) => b.path.length === 0)?.message ?? issue.message });
      return;
    }
    for (const b of best) flatten(b, path, out);
    return;
  }
  out.push({ path: formatPath(path), message: issue.message });
}

/**
 * Parse `input` with `schema`, or throw `EngineValidationError` listing every problem.
 * @example parseOrThrow(spectraRequestSchema, body) // typed SpectraRequest, or throws
 */
export function parseOrThrow<T>(schema: z.ZodType<T>, input: unknown): T {
  const r = schema.safeParse(input);
  if (r.success) return r.data;
  const issues: ValidationIssue[] = [];
  for (const iss of r.error.issues) flatten(iss as unknown as RawIssue, [], issues);
  throw new EngineValidationError(issues);
}

/** Validate a spectra request (throws `EngineValidationError`). Example: `validateSpectraRequest(JSON.parse(body))`. */
export function validateSpectraRequest(input: unknown): SpectraRequest {
  return parseOrThrow(spectraRequestSchema, input) as SpectraRequest;
}

/** Validate a sweep request (throws `EngineValidationError`). Example: `validateSweepRequest(JSON.parse(body))`. */
export function validateSweepRequest(input: unknown): SweepRequest {
  return parseOrThrow(sweepRequestSchema, input) as SweepRequest;
}
