/**
 * Population spreads: the varying parameters of a population spec, sampling them with a seeded generator
 * (normal or log-normal, truncated to physical values), and turning each sampled cell into an engine particle.
 */
import type { Particle } from "@/lib/dielectric";
import { mulberry32, normalSource, streamSeed } from "./prng";
import { POPULATION_FIELDS } from "@/lib/populations/fields";
import { fitLayer } from "@/lib/populations/spec";
import type { PopulationSpec, SpreadParameter } from "./schema";

/**
 * Every parameter that can vary, with the physical range draws are truncated to (SI), from the population field
 * table (lib/populations/fields.ts). Order fixes the random streams.
 */
export const SPREAD_PARAMETERS: readonly { path: string; min: number; max: number; unit: string }[] = POPULATION_FIELDS.filter((f) => f.spread).map((f) => ({ path: f.path, min: f.min, max: f.max, unit: f.si }));

/** Dotted path of a spread parameter, e.g. "membrane.capacitance". */
export type SpreadPath = string;

/**
 * The spread parameter at a dotted path, or undefined when the spec has no such part.
 * @example spreadAt(spec, "membrane.capacitance") // → { mean: 0.01, cv: 0.1, distribution: "normal" }
 */
export function spreadAt(spec: PopulationSpec, path: string): SpreadParameter | undefined {
  let node: unknown = spec;
  for (const key of path.split(".")) {
    if (node === undefined || node === null || typeof node !== "object") return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  const p = node as SpreadParameter | undefined;
  return p && typeof p.mean === "number" ? p : undefined;
}

/**
 * The spread parameters a spec actually uses, in stream order.
 * @example presentParameters(singleShellSpec).map((p) => p.path) // → ["radius", "interior.permittivity", …]
 */
export function presentParameters(spec: PopulationSpec): { index: number; path: SpreadPath; min: number; max: number; unit: string; spread: SpreadParameter }[] {
  const out = [];
  for (let index = 0; index < SPREAD_PARAMETERS.length; index++) {
    const def = SPREAD_PARAMETERS[index];
    if (!usesPath(spec, def.path)) continue;
    const spread = spreadAt(spec, def.path);
    if (spread) out.push({ index, ...def, spread });
  }
  return out;
}

function usesPath(spec: PopulationSpec, path: string): boolean {
  if (path.startsWith("membrane.")) return spec.model !== "homogeneous";
  if (path.startsWith("wall.")) return spec.model === "walled";
  if (path.startsWith("nucleus.")) return spec.model === "nucleated";
  return true;
}

/**
 * A copy of the spec with one parameter's mean replaced (for sensitivity).
 * @example withMean(spec, "radius", 5.5e-6).radius.mean // → 5.5e-6
 */
export function withMean(spec: PopulationSpec, path: string, mean: number): PopulationSpec {
  const copy = structuredClone(spec) as PopulationSpec;
  const p = spreadAt(copy, path);
  if (p) p.mean = mean;
  return copy;
}

/**
 * One draw from a spread: normal (mean, sd = cv·mean) or log-normal with that mean and CV, truncated to [min, max]
 * by redrawing (at most 64 times, then clamped).
 * @example drawValue({ mean: 5e-6, cv: 0.1 }, 1e-7, 1e-4, normalSource(mulberry32(1)))
 */
export function drawValue(p: SpreadParameter, min: number, max: number, z: () => number): number {
  if (p.cv === 0 || p.mean === 0) return Math.min(max, Math.max(min, p.mean));
  const logNormal = p.distribution === "lognormal";
  const s2 = Math.log(1 + p.cv * p.cv);
  const mu = Math.log(p.mean) - s2 / 2;
  const s = Math.sqrt(s2);
  let v = p.mean;
  for (let i = 0; i < 64; i++) {
    v = logNormal ? Math.exp(mu + s * z()) : p.mean * (1 + p.cv * z());
    if (v >= min && v <= max) return v;
  }
  return Math.min(max, Math.max(min, v));
}

type Values = Partial<Record<SpreadPath, number>>;

/**
 * The engine particle for one set of parameter values (means where a value is missing). The nucleated model's
 * cytoplasm becomes a thick shell between the membrane and the nuclear envelope. Each layer is kept inside the one
 * around it with `fitLayer` (the population schema's geometry rule; means that pass the schema are never changed,
 * only sampled cells whose drawn radius is too small for their layers).
 * @example particleFrom("live", spec, { radius: 5.2e-6 })
 */
export function particleFrom(id: string, spec: PopulationSpec, values: Values = {}): Particle {
  const v = (path: SpreadPath) => values[path] ?? (spreadAt(spec, path)?.mean as number);
  const radius = v("radius");
  const interior = { permittivity: v("interior.permittivity"), conductivity: v("interior.conductivity") };
  if (spec.model === "homogeneous") {
    const ks = spec.surfaceConductance ?? 0;
    return { id, radius, core: { permittivity: interior.permittivity, conductivity: interior.conductivity + (2 * ks) / radius }, shells: [] };
  }
  const m = spec.membrane!;
  const membrane = { thickness: fitLayer(m.thickness, radius), capacitance: v("membrane.capacitance"), conductance: v("membrane.conductance") };
  if (spec.model === "single-shell") return { id, radius, core: interior, shells: [membrane] };
  if (spec.model === "walled") {
    const wallThickness = fitLayer(v("wall.thickness"), radius - membrane.thickness);
    return { id, radius, core: interior, shells: [{ thickness: wallThickness, permittivity: v("wall.permittivity"), conductivity: v("wall.conductivity") }, membrane] };
  }
  const n = spec.nucleus!;
  const inside = radius - membrane.thickness;
  const nucleusRadius = fitLayer(v("nucleus.radiusFraction") * radius, inside);
  const envelope = { thickness: fitLayer(n.envelope.thickness, nucleusRadius), capacitance: v("nucleus.envelope.capacitance"), conductance: v("nucleus.envelope.conductance") };
  return {
    id,
    radius,
    core: { permittivity: v("nucleus.nucleoplasm.permittivity"), conductivity: v("nucleus.nucleoplasm.conductivity") },
    shells: [membrane, { thickness: inside - nucleusRadius, ...interior }, envelope],
  };
}

/**
 * Sample `count` cells of a population. Each parameter has its own random stream (seed, population index,
 * parameter index), so changing one parameter's spread leaves the other parameters' draws unchanged.
 * @example samplePopulation(spec, "live", 500, 42, 0).length // → 500
 */
export function samplePopulation(spec: PopulationSpec, id: string, count: number, seed: number, populationIndex: number): Particle[] {
  const params = presentParameters(spec);
  const streams = params.map((p) => normalSource(mulberry32(streamSeed(seed, populationIndex, p.index))));
  const cells: Particle[] = new Array(count);
  for (let c = 0; c < count; c++) {
    const values: Values = {};
    params.forEach((p, k) => {
      values[p.path] = drawValue(p.spread, p.min, p.max, streams[k]);
    });
    cells[c] = particleFrom(id, spec, values);
  }
  return cells;
}
