/**
 * Turns a validated `planWindows` request into a `GridSetup`: defaults resolved, populations sampled, device Γ and
 * medium properties computed. Shared by `planWindows` and `sensitivity`.
 */
import {
  compileParticle,
  deviceField,
  logSpace,
  parseOrThrow,
  vppToVrms,
  waterPermittivity,
  waterThermalConductivity,
  waterViscosity,
  type DeviceField,
} from "@/lib/dielectric";
import { DEFAULT_TARGET_SPEED, resolveConstraints, resolveSeparation, type Constraints, type SeparationSettings } from "./constraints";
import type { SortDesign } from "./design";
import type { GridSetup, PopulationSample } from "./evaluate";
import { particleFrom, samplePopulation } from "./populations";
import { windowsRequestSchema, type PopulationEntry, type PopulationSpec, type WindowsRequest } from "./schema";

/** Defaults of the request's optional parts. */
export const REQUEST_DEFAULTS = {
  frequencies: { start: 1e3, stop: 1e9, points: 121 },
  temperatureC: 25,
  seed: 1,
  samplesPerPopulation: 500,
  topN: 10,
  targetFraction: 0.5,
  sortDesign: { kind: "opposite-deflection" } as SortDesign,
} as const;

/** A request with every default resolved. */
export interface ResolvedRequest {
  populations: PopulationEntry[];
  target: PopulationEntry;
  other: PopulationEntry;
  targetIndex: number;
  frequencies: number[];
  conductivities: number[];
  temperatureC: number;
  mediumPermittivity: number;
  viscosity: number;
  thermalConductivity: number;
  osmolality: number | null;
  field: DeviceField;
  maxVoltageVpp: number;
  targetSpeed: number;
  targetSpeedSource: string;
  constraints: Constraints;
  separation: SeparationSettings;
  design: SortDesign;
  targetFraction: number;
  seed: number;
  samples: number;
  topN: number;
}

/**
 * Validate (throws `EngineValidationError`) and resolve defaults.
 * @example resolveRequest(body).frequencies.length // → 121 by default
 */
export function resolveRequest(input: WindowsRequest): ResolvedRequest {
  const r = parseOrThrow(windowsRequestSchema, input);
  const targetIndex = r.targetId === undefined ? 0 : r.populations.findIndex((p) => p.id === r.targetId);
  const temperatureC = r.medium.temperatureC ?? REQUEST_DEFAULTS.temperatureC;
  const d = r.device;
  let targetSpeed: number = DEFAULT_TARGET_SPEED.value;
  let targetSpeedSource: string = `default ${DEFAULT_TARGET_SPEED.value} m/s: ${DEFAULT_TARGET_SPEED.reason}`;
  if (d.targetDepSpeed !== undefined) {
    targetSpeed = d.targetDepSpeed;
    targetSpeedSource = "entered by the user";
  } else if (d.flowSpeed !== undefined && d.flowSpeed > 0 && d.electrodeArrayLength !== undefined) {
    targetSpeed = (d.channelHeight * d.flowSpeed) / d.electrodeArrayLength;
    targetSpeedSource = `from the flow: a cell must cross the channel height (${d.channelHeight} m) while the flow (${d.flowSpeed} m/s) carries it along the electrode array (${d.electrodeArrayLength} m)`;
  }
  const constraints = resolveConstraints(r.constraints ?? {});
  const osmolality = r.medium.osmolality ?? null;
  return {
    populations: r.populations,
    target: r.populations[targetIndex],
    other: r.populations[1 - targetIndex],
    targetIndex,
    frequencies: logSpace(r.frequencies ?? REQUEST_DEFAULTS.frequencies),
    conductivities: r.medium.conductivityRange ? logSpace(r.medium.conductivityRange) : [r.medium.conductivity as number],
    temperatureC,
    mediumPermittivity: r.medium.permittivity ?? waterPermittivity(temperatureC),
    viscosity: waterViscosity(temperatureC) * (r.medium.relativeViscosity ?? 1),
    thermalConductivity: waterThermalConductivity(temperatureC),
    osmolality,
    field: deviceField(d.geometry),
    maxVoltageVpp: d.maxVoltageVpp,
    targetSpeed,
    targetSpeedSource,
    constraints,
    separation: resolveSeparation(r.separation ?? {}),
    design: (r.sortDesign as SortDesign | undefined) ?? REQUEST_DEFAULTS.sortDesign,
    targetFraction: r.inputMix?.targetFraction ?? REQUEST_DEFAULTS.targetFraction,
    seed: r.seed ?? REQUEST_DEFAULTS.seed,
    samples: r.samplesPerPopulation ?? REQUEST_DEFAULTS.samplesPerPopulation,
    topN: r.topN ?? REQUEST_DEFAULTS.topN,
  };
}

function sampleOf(entry: PopulationEntry, spec: PopulationSpec, samples: number, seed: number, index: number): PopulationSample {
  const particles = [...samplePopulation(spec, entry.id, samples, seed, index), particleFrom(entry.id, spec)];
  const r2 = new Float64Array(particles.length);
  particles.forEach((p, k) => (r2[k] = p.radius * p.radius));
  return { id: entry.id, cells: particles.map(compileParticle), r2 };
}

/**
 * The grid setup for a resolved request, optionally with other frequencies/conductivities or replaced specs.
 * @example buildSetup(resolveRequest(body)).target.cells.length // → 501 (500 samples + the mean cell)
 */
export function buildSetup(
  r: ResolvedRequest,
  override: { frequencies?: number[]; conductivities?: number[]; specs?: Record<string, PopulationSpec> } = {},
): GridSetup {
  const spec = (e: PopulationEntry) => override.specs?.[e.id] ?? e.spec;
  const index = (e: PopulationEntry) => r.populations.indexOf(e);
  const ts = spec(r.target);
  const membrane = ts.model === "homogeneous" || !ts.membrane
    ? null
    : { radius: ts.radius.mean, capacitance: ts.membrane.capacitance.mean, cytoplasmConductivity: ts.interior.conductivity.mean };
  const c = r.constraints;
  return {
    frequencies: override.frequencies ?? r.frequencies,
    conductivities: override.conductivities ?? r.conductivities,
    target: sampleOf(r.target, ts, r.samples, r.seed, index(r.target)),
    other: sampleOf(r.other, spec(r.other), r.samples, r.seed, index(r.other)),
    design: r.design,
    constraints: c,
    separation: r.separation,
    mediumPermittivity: r.mediumPermittivity,
    viscosity: r.viscosity,
    thermalConductivity: r.thermalConductivity,
    gamma: r.field.gamma,
    fieldPerVolt: r.field.fieldPerVolt,
    length: r.field.length,
    targetSpeed: r.targetSpeed,
    maxVoltageRms: vppToVrms(r.maxVoltageVpp),
    targetFraction: r.targetFraction,
    osmolalityOk: r.osmolality === null || (r.osmolality >= c.osmolalityMin && r.osmolality <= c.osmolalityMax),
    membrane,
  };
}
