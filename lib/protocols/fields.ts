import { UnitKind } from "@/lib/units/format";

/** Names and units of the leaf fields of a protocol content, for read-only display and for the diff. */

const WORDS: Record<string, string> = {
  populations: "", target: "Target", other: "Other", spec: "", name: "name", model: "shell model",
  radius: "radius", interior: "interior", membrane: "membrane", wall: "wall", nucleus: "nucleus", envelope: "envelope",
  nucleoplasm: "nucleoplasm", radiusFraction: "radius fraction", thickness: "thickness", capacitance: "capacitance",
  conductance: "conductance", permittivity: "permittivity", conductivity: "conductivity", surfaceConductance: "surface conductance",
  mean: "", cv: "spread (CV)", distribution: "distribution", buffer: "Buffer", recipe: "recipe", sucrosePercentWV: "sucrose (% w/v)",
  glucosePercentWV: "glucose (% w/v)", additions: "addition", label: "label", kind: "kind", perLitre: "per litre",
  conductivity25: "predicted conductivity at 25 °C", osmolality: "osmolality", targetConductivity25: "target conductivity at 25 °C",
  tolerance: "conductivity tolerance", maxMinutesInBuffer: "longest time in buffer", device: "Device", geometry: "geometry",
  dimensions: "", gradientFactor: "gradient factor Γ", gradientSource: "gradient source", maxVoltageVpp: "generator limit",
  sortDesign: "Sort design", inputMix: "Input mix", targetFraction: "target fraction", limits: "Limit", cellPrep: "Cell preparation",
  washes: "washes", resuspensionCellsPerMl: "resuspension density", notes: "notes", libraryRef: "library item", id: "id", version: "item version",
  selection: "Selection", frequency: "frequency", band: "band", low: "low edge", high: "high edge", voltageVrms: "drive voltage (RMS)",
  voltageVpp: "drive voltage (peak to peak)", deltaTMaxK: "largest temperature rise", transmembraneMaxV: "largest induced transmembrane potential", waveform: "waveform", flowRateUlPerMin: "flow rate", temperatureC: "temperature", predicted: "predicted",
  recovery: "recovery", purity: "purity", deltaT: "temperature rise", behaviour: "behaviour", reK: "Re[K]", rank: "rank", score: "score",
  electrodeWidth: "electrode width", electrodeGap: "electrode gap", channelHeight: "channel height", width: "width", gap: "gap",
  maxTemperatureRiseK: "largest temperature rise", maxElectrothermalRatio: "largest electrothermal/DEP speed ratio",
  maxTransmembranePotentialV: "largest induced transmembrane potential", separationMarginReK: "separation margin on Re[K]",
  slowCellShare: "slow-cell share sized for", minRecovery: "lowest acceptable recovery", minPurity: "lowest acceptable purity",
  osmolalityMinOsmolPerKg: "lowest osmolality", osmolalityMaxOsmolPerKg: "highest osmolality",
};

const UNIT_BY_KEY: Record<string, UnitKind> = {
  radius: "length", thickness: "length", capacitance: "capacitance", conductance: "conductance", conductivity: "conductivity",
  conductivity25: "conductivity", targetConductivity25: "conductivity", permittivity: "relative", cv: "percent", tolerance: "percent",
  targetFraction: "percent", radiusFraction: "percent", frequency: "frequency", low: "frequency", high: "frequency",
  voltageVpp: "vpp", maxVoltageVpp: "vpp", voltageVrms: "vrms", flowRateUlPerMin: "flow", temperatureC: "celsius",
  deltaT: "kelvin", recovery: "percent", purity: "percent", osmolality: "osmolalityMilli", resuspensionCellsPerMl: "density",
  maxMinutesInBuffer: "minutes", osmolalityMinOsmolPerKg: "osmolality", osmolalityMaxOsmolPerKg: "osmolality", maxElectrothermalRatio: "plain", separationMarginReK: "plain", gradientFactor: "gradient", width: "length", gap: "length", height: "length",
  deltaTMaxK: "kelvin", transmembraneMaxV: "volts", electrodeWidth: "length", electrodeGap: "length", channelHeight: "length",
  maxTemperatureRiseK: "kelvin", maxTransmembranePotentialV: "volts", slowCellShare: "percent", minRecovery: "percent", minPurity: "percent",
};

/**
 * A readable label and unit kind for a dotted content path (array indices shown as "#1").
 * @example describePath("populations.target.spec.membrane.capacitance.mean")
 *   // { label: "Target · membrane capacitance", kind: "capacitance" }
 */
export function describePath(path: string): { label: string; kind: UnitKind } {
  const parts = path.split(".");
  const words = parts
    .map((p) => (/^\d+$/.test(p) ? `#${Number(p) + 1}` : p in WORDS ? WORDS[p] : p))
    .filter(Boolean);
  const [head, ...rest] = words;
  const label = rest.length ? `${head} · ${rest.join(" ")}` : head ?? path;
  const key = [...parts].reverse().find((p) => p !== "mean" && !/^\d+$/.test(p)) ?? "";
  const last = parts[parts.length - 1];
  const kind: UnitKind = last === "cv" ? "percent" : UNIT_BY_KEY[key] ?? "plain";
  return { label, kind };
}

/**
 * Flattens a JSON value to its leaves as dotted paths.
 * @example flatten({ a: { b: 1 }, c: [2] }) // [["a.b", 1], ["c.0", 2]]
 */
export function flatten(value: unknown, prefix = ""): [string, unknown][] {
  if (value !== null && typeof value === "object") {
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value as Record<string, unknown>);
    if (entries.length === 0) return [[prefix, Array.isArray(value) ? "(none)" : "(empty)"]];
    return entries.flatMap(([k, v]) => flatten(v, prefix ? `${prefix}.${k}` : k));
  }
  return [[prefix, value]];
}
