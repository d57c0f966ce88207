import { evaluateSpectra, type SpectraResult } from "@/lib/dielectric";
import { particleFrom, type OperatingWindow, type WindowsRequest, type WindowsResult } from "@/lib/planner";
import { protocolContentSchema, type ProtocolContent } from "@/lib/protocols/content";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { conductivityAt25 } from "@/lib/units/conductivity-temperature";
import { ADDITION_NAMES, isSalt } from "@/lib/buffers/recipe";
import { bufferChoice, type BufferStepValues } from "./buffer-form";
import { stepFrequencyRange, stepSI, type DeviceStepValues } from "./device-form";
import { geometrySI, limitsSI } from "./request";
import type { LimitsStepValues } from "./limits-form";
import type { PopulationsStepOutput } from "./population-form";
import { behaviourText, toProtocolWarning } from "./results-data";
import { rangeRecipe } from "./range-recipe";
import type { SaveStepValues } from "./save-form";

/** Everything the protocol content is built from. */
export interface ContentSources {
  populations: PopulationsStepOutput;
  buffer: BufferStepValues;
  device: DeviceStepValues;
  limits: LimitsStepValues;
  request: WindowsRequest;
  result: WindowsResult;
  window: OperatingWindow;
  save: Pick<SaveStepValues, "washes" | "resuspensionMillionsPerMl" | "notes">;
  flowRateUlPerMin: number | null;
}

/** Mean-cell Re[K] of both populations at the operating point. */
function reKAt(src: ContentSources): { target: number; other: number } {
  const { frequency, conductivity } = src.window.operatingPoint;
  const res: SpectraResult = evaluateSpectra({
    medium: { conductivity, permittivity: src.result.model.medium.permittivity },
    frequencies: [frequency],
    particles: [particleFrom("target", src.populations.target.spec), particleFrom("other", src.populations.other.spec)],
  });
  return { target: res.particles[0].re[0], other: res.particles[1].re[0] };
}

/**
 * The frozen protocol content of a chosen window: populations, buffer, device, limits, cell preparation, the
 * selection with its predictions, warnings and behaviour text, and the plan (engine version, seed, request, result).
 * Validated with `protocolContentSchema` (throws InputError naming any bad field).
 * @example buildContent(src).selection.voltageVpp // 12.4
 */
export function buildContent(src: ContentSources): ProtocolContent {
  const { populations, buffer, device, limits, request, result, window: w } = src;
  const choice = bufferChoice(buffer);
  const sigma25 = conductivityAt25(w.operatingPoint.conductivity, device.operatingTemperatureC);
  const g = geometrySI(device);
  const channelHeight = stepSI(device, "channelHeight");
  const geometryDims: Record<string, number> =
    g.kind === "interdigitated" ? { electrodeWidth: g.electrodeWidth, electrodeGap: g.electrodeGap, height: g.height!, channelHeight } : { electrodeGap: g.electrodeGap, channelHeight };
  const l = limitsSI(limits);
  const content: ProtocolContent = {
    populations: {
      target: { name: populations.target.name, ...(populations.target.libraryRef ? { libraryRef: populations.target.libraryRef } : {}), spec: populations.target.spec },
      other: { name: populations.other.name, ...(populations.other.libraryRef ? { libraryRef: populations.other.libraryRef } : {}), spec: populations.other.spec },
    },
    buffer: {
      name: buffer.name,
      ...(buffer.libraryRef ? { libraryRef: buffer.libraryRef } : {}),
      recipe: buffer.mode === "range" ? rangeRecipe(buffer.sucrosePercentWV, buffer.glucosePercentWV, sigma25) :
        buffer.mode === "recipe" && choice.recipe
          ? {
              sucrosePercentWV: buffer.sucrosePercentWV,
              glucosePercentWV: buffer.glucosePercentWV,
              additions: buffer.additions.map((a) => ({ label: ADDITION_NAMES[a.kind], kind: isSalt(a.kind) ? "solid" : "stock", perLitre: a.perLitre })),
              conductivity25: choice.recipe.conductivity25,
              osmolality: choice.recipe.osmolality * 1000,
            }
          : null,
      targetConductivity25: choice.conductivity25 ?? sigma25,
      tolerance: buffer.tolerancePercent / 100,
      osmolality: choice.osmolality === null ? null : choice.osmolality * 1000,
      maxMinutesInBuffer: buffer.maxMinutesInBuffer,
    },
    device: {
      name: device.name,
      ...(device.libraryRef ? { libraryRef: device.libraryRef } : {}),
      geometry: device.geometry === "interdigitated" ? "interdigitated" : "user-gradient",
      dimensions: geometryDims,
      gradientFactor: result.model.device.gamma,
      gradientSource: device.geometry === "interdigitated" ? result.model.device.approximation : `${device.gammaSource} (user value)`,
      maxVoltageVpp: device.maxVoltageVpp,
      ...stepFrequencyRange(device),
    },
    sortDesign: result.model.design.description,
    inputMix: { targetFraction: l.targetFraction },
    limits: {
      maxTemperatureRiseK: l.maxTemperatureRise,
      maxElectrothermalRatio: l.maxElectrothermalRatio,
      maxTransmembranePotentialV: l.maxTransmembranePotential,
      separationMarginReK: l.margin,
      slowCellShare: l.slowCellQuantile,
      minRecovery: l.minRecovery,
      minPurity: l.minPurity,
      osmolalityMinOsmolPerKg: l.osmolalityMin,
      osmolalityMaxOsmolPerKg: l.osmolalityMax,
    },
    cellPrep: { washes: src.save.washes, resuspensionCellsPerMl: src.save.resuspensionMillionsPerMl * 1e6, notes: src.save.notes },
    selection: {
      frequency: w.operatingPoint.frequency,
      band: { low: w.bandStart, high: w.bandStop },
      conductivity: w.operatingPoint.conductivity,
      voltageVrms: w.voltage.rms,
      voltageVpp: w.voltage.vpp,
      waveform: "sine",
      flowRateUlPerMin: src.flowRateUlPerMin,
      temperatureC: device.operatingTemperatureC,
      predicted: { recovery: w.recovery, purity: w.purity, deltaT: w.temperatureRise },
      behaviour: { target: behaviourText(w, "target"), other: behaviourText(w, "other") },
      reK: reKAt(src),
      rank: w.rank,
      score: w.score,
      warnings: [...w.warnings, ...result.warnings].map(toProtocolWarning),
    },
    plan: { engineVersion: result.engineVersion, seed: result.model.seed, request, result },
  };
  return parseOrThrow(protocolContentSchema, content);
}
