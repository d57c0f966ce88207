/**
 * Turns a validated `planWindows` request into a `GridSetup`: defaults resolved, populations sampled, device Γ and
 * medium properties computed. Shared by `planWindows` and `sensitivity`.
 */
import {
  CHIP_THERMAL_CONDUCTIVITY,
  compileParticle,
  gapConductanceFactor,
  deviceField,
  logSpace,
  parseOrThrow,
  vppToVrms,
  waterPermittivity,
  waterThermalConductivity,
  waterViscosity,
  type DeviceField,
} from "@/lib/dielectric";
import { DEFAULT_TARGET_SPEED, osmolalityBandFor, resolveConstraints, resolveSeparation, type Constraints, type OsmolalityBand, type SeparationSettings } from "./constraints";
import type { SortDesign } from "./design";
import type { GridSetup, HeatingModel, PopulationSample } from "./evaluate";
import { particleFrom, samplePopulation } from "./populations";
import { windowsRequestSchema, type PopulationEntry, type PopulationSpec, type WindowsRequest } from "./schema";
import { formatLength, formatVelocity } from "@/lib/units/format";

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
  /** The generator's frequency range, Hz, or null. */
  frequencyRange: { min: number; max: number } | null;
  /** Heating estimates per σV² and what they rest on. */
  heating: HeatingModel & { arrayArea: number | null; arrayAreaSource: string; effectiveThermalConductivity: number | null; description: string };
  /** The osmolality band that fits these cells (used when the request gives none). */
  osmolalityBand: OsmolalityBand;
  /** Capture against a flow: the local flow speed at the evaluation height the captured cells must resist, or null. */
  holding: { height: number; heightSource: string; meanFlowSpeed: number; localFlowSpeed: number; crossingSpeed: number | null } | null;
}

/** Array area assumed for the heating estimate when none is given, m² (a 1 mm × 1 mm array). */
export const DEFAULT_ARRAY_AREA = 1e-6;

/**
 * Flow speed at height z in a channel of height H with mean speed ū (plane Poiseuille profile between the floor and
 * the lid): u(z) = 6ū (z/H)(1 − z/H); the centre line runs at 1.5ū.
 * @example poiseuilleSpeed(833e-6, 10e-6, 50e-6) // → 8.0e-4 m/s
 */
export function poiseuilleSpeed(meanSpeed: number, height: number, channelHeight: number): number {
  const t = Math.min(1, Math.max(0, height / channelHeight));
  return 6 * meanSpeed * t * (1 - t);
}

type Device = ReturnType<typeof parseRequest>["device"];
const parseRequest = (input: WindowsRequest) => parseOrThrow(windowsRequestSchema, input);

function heatingOf(d: Device, thermalConductivity: number): ResolvedRequest["heating"] {
  const isolated = 1 / (8 * thermalConductivity);
  const g = d.geometry;
  const isArray = g.kind === "interdigitated" || d.electrodeArrayArea !== undefined;
  if (!isArray) {
    return { isolated, array: null, checked: "isolated", arrayArea: null, arrayAreaSource: "", effectiveThermalConductivity: null, description: "Joule heating ΔT ≈ σV²/(8k) for an isolated pair of coplanar electrodes (Ramos et al. 1998); no array area was given, so the array estimate is not made." };
  }
  const w = g.kind === "interdigitated" ? g.electrodeWidth : g.electrodeGap;
  const gap = g.electrodeGap;
  const area = d.electrodeArrayArea ?? DEFAULT_ARRAY_AREA;
  const areaSource = d.electrodeArrayArea !== undefined ? "as entered" : "assumed 1 mm² (no array area given)";
  const kEff = (d.substrateThermalConductivity ?? CHIP_THERMAL_CONDUCTIVITY.glass) + (d.lidThermalConductivity ?? CHIP_THERMAL_CONDUCTIVITY.pdms);
  const radius = Math.sqrt(area / Math.PI);
  const array = (8 * gapConductanceFactor(w, gap) * area) / ((w + gap) * 3 * Math.PI * Math.PI * kEff * radius);
  const walls = `${d.substrateThermalConductivity === undefined ? "glass substrate (1.05 W/(m·K))" : `substrate ${d.substrateThermalConductivity} W/(m·K)`} + ${d.lidThermalConductivity === undefined ? "PDMS lid (0.15 W/(m·K))" : `lid ${d.lidThermalConductivity} W/(m·K)`}`;
  return {
    isolated,
    array,
    checked: "array",
    arrayArea: area,
    arrayAreaSource: areaSource,
    effectiveThermalConductivity: kEff,
    description: `Joule heating: the temperature limit is checked against the interdigitated-array estimate — every gap dissipates σV²·K(k′)/(2K(k)) per unit length (≈ σV²/(4d) per unit area for width = gap), and the array (${area} m², ${areaSource}) is treated as a uniform disc source on the chip, ΔT ≈ 8P/(3π² k_eff a) with k_eff from the ${walls} (Carslaw & Jaeger; order of magnitude). The isolated-pair estimate σV²/(8k) (Ramos et al. 1998) is shown beside it.`,
  };
}

/**
 * Validate (throws `EngineValidationError`) and resolve defaults.
 * @example resolveRequest(body).frequencies.length // → 121 by default
 */
export function resolveRequest(input: WindowsRequest): ResolvedRequest {
  const r = parseRequest(input);
  const targetIndex = r.targetId === undefined ? 0 : r.populations.findIndex((p) => p.id === r.targetId);
  const temperatureC = r.medium.temperatureC ?? REQUEST_DEFAULTS.temperatureC;
  const d = r.device;
  let targetSpeed: number = DEFAULT_TARGET_SPEED.value;
  let targetSpeedSource: string = `default ${formatVelocity(DEFAULT_TARGET_SPEED.value)}: ${DEFAULT_TARGET_SPEED.reason}`;
  if (d.targetDepSpeed !== undefined) {
    targetSpeed = d.targetDepSpeed;
    targetSpeedSource = "entered by the user";
  } else if (d.flowSpeed !== undefined && d.flowSpeed > 0 && d.electrodeArrayLength !== undefined) {
    targetSpeed = (d.channelHeight * d.flowSpeed) / d.electrodeArrayLength;
    targetSpeedSource = `from the flow: a cell must cross the channel height (${formatLength(d.channelHeight)}) while the flow (${formatVelocity(d.flowSpeed)}) carries it along the electrode array (${formatLength(d.electrodeArrayLength)})`;
  }
  const osmolalityBand = osmolalityBandFor(r.populations.map((p) => p.spec.model));
  const constraints = resolveConstraints({ osmolalityMin: osmolalityBand.min, osmolalityMax: osmolalityBand.max, ...(r.constraints ?? {}) });
  const osmolality = r.medium.osmolality ?? null;
  const design = (r.sortDesign as SortDesign | undefined) ?? REQUEST_DEFAULTS.sortDesign;
  let holding: ResolvedRequest["holding"] = null;
  if (design.kind === "capture" && d.flowSpeed !== undefined && d.flowSpeed > 0) {
    // The captured cells must be held where they sit: DEP force at the evaluation height above the local Stokes drag,
    // i.e. a DEP speed at least the local flow speed of the parabolic profile.
    const captured = r.populations[(design.captured ?? "target") === "target" ? targetIndex : 1 - targetIndex];
    const g = d.geometry;
    const height = g.height ?? (g.kind === "interdigitated" ? g.electrodeGap / 2 : captured.spec.radius.mean);
    const heightSource = g.height !== undefined ? "the evaluation height entered" : g.kind === "interdigitated" ? "half the electrode gap (default evaluation height)" : "one cell radius (a cell resting on the electrodes; no evaluation height given)";
    const local = poiseuilleSpeed(d.flowSpeed, height, d.channelHeight);
    const crossing = d.targetDepSpeed === undefined && d.electrodeArrayLength !== undefined ? targetSpeed : null;
    holding = { height, heightSource, meanFlowSpeed: d.flowSpeed, localFlowSpeed: local, crossingSpeed: crossing };
    if (local > targetSpeed) {
      targetSpeed = local;
      targetSpeedSource = `to hold the captured cells against the flow: the local flow speed at ${formatLength(height)} above the electrodes (${heightSource}) in a parabolic profile with mean ${formatVelocity(d.flowSpeed)} between walls ${formatLength(d.channelHeight)} apart, which is faster than crossing the channel`;
    }
  }
  const thermalConductivity = waterThermalConductivity(temperatureC);
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
    thermalConductivity,
    osmolality,
    field: deviceField(d.geometry),
    maxVoltageVpp: d.maxVoltageVpp,
    targetSpeed,
    targetSpeedSource,
    constraints,
    separation: resolveSeparation(r.separation ?? {}),
    design,
    targetFraction: r.inputMix?.targetFraction ?? REQUEST_DEFAULTS.targetFraction,
    seed: r.seed ?? REQUEST_DEFAULTS.seed,
    samples: r.samplesPerPopulation ?? REQUEST_DEFAULTS.samplesPerPopulation,
    topN: r.topN ?? REQUEST_DEFAULTS.topN,
    frequencyRange: d.generatorMinFrequency !== undefined || d.generatorMaxFrequency !== undefined ? { min: d.generatorMinFrequency ?? 0, max: d.generatorMaxFrequency ?? Number.POSITIVE_INFINITY } : null,
    heating: heatingOf(d, thermalConductivity),
    holding,
    osmolalityBand,
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
    heating: { isolated: r.heating.isolated, array: r.heating.array, checked: r.heating.checked },
    frequencyRange: r.frequencyRange,
  };
}
