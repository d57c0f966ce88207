import type { ProtocolContent } from "@/lib/protocols/content";

/**
 * A complete, valid protocol content for tests: viable vs heat-killed brewing yeast in a sucrose buffer.
 * Invented demo values (plausible orders of magnitude, not measurements); SI units as stored.
 */
export function yeastProtocolContent(overrides: Partial<ProtocolContent> = {}): ProtocolContent {
  const membrane = (cap: number, cond: number) => ({
    thickness: 8e-9,
    capacitance: { mean: cap, cv: 0.1, distribution: "normal" as const },
    conductance: { mean: cond, cv: 0.2, distribution: "lognormal" as const },
  });
  const base: ProtocolContent = {
    populations: {
      target: {
        name: "Viable brewing yeast",
        spec: {
          model: "walled",
          radius: { mean: 2.5e-6, cv: 0.12, distribution: "normal" },
          interior: { permittivity: { mean: 50, cv: 0.05, distribution: "normal" }, conductivity: { mean: 0.2, cv: 0.1, distribution: "normal" } },
          membrane: membrane(0.0075, 1),
          wall: {
            thickness: { mean: 220e-9, cv: 0.1, distribution: "normal" },
            permittivity: { mean: 60, cv: 0.05, distribution: "normal" },
            conductivity: { mean: 0.014, cv: 0.15, distribution: "normal" },
          },
        },
      },
      other: {
        name: "Heat-killed brewing yeast",
        spec: {
          model: "walled",
          radius: { mean: 2.4e-6, cv: 0.12, distribution: "normal" },
          interior: { permittivity: { mean: 50, cv: 0.05, distribution: "normal" }, conductivity: { mean: 0.007, cv: 0.2, distribution: "normal" } },
          membrane: membrane(0.0075, 3000),
          wall: {
            thickness: { mean: 220e-9, cv: 0.1, distribution: "normal" },
            permittivity: { mean: 60, cv: 0.05, distribution: "normal" },
            conductivity: { mean: 0.0016, cv: 0.15, distribution: "normal" },
          },
        },
      },
    },
    buffer: {
      name: "Sucrose 8.5 % with KCl",
      recipe: {
        sucrosePercentWV: 8.5,
        glucosePercentWV: 0.3,
        additions: [{ label: "KCl 1 M stock", kind: "stock", perLitre: 0.12 }],
        conductivity25: 0.0025,
        osmolality: 280,
      },
      targetConductivity25: 0.0025,
      tolerance: 0.1,
      osmolality: 280,
      maxMinutesInBuffer: 30,
    },
    device: {
      name: "Interdigitated chip, 50 µm",
      geometry: "interdigitated",
      dimensions: { width: 50e-6, gap: 50e-6, height: 40e-6 },
      gradientFactor: 1.2e13,
      gradientSource: "preset: interdigitated 50/50 µm",
      maxVoltageVpp: 20,
    },
    sortDesign: "trap-and-release",
    inputMix: { targetFraction: 0.6 },
    limits: { deltaTMaxK: 2, transmembraneMaxV: 0.5 },
    cellPrep: { washes: 2, resuspensionCellsPerMl: 5e6, notes: "Wash twice in buffer, 2 min at 1000 g." },
    selection: {
      frequency: 5e6,
      band: { low: 2e6, high: 12e6 },
      conductivity: 0.0025,
      voltageVrms: 3.5,
      voltageVpp: 10,
      waveform: "sine",
      flowRateUlPerMin: 2,
      temperatureC: 22,
      predicted: { recovery: 0.91, purity: 0.95, deltaT: 0.3 },
      behaviour: { target: "positive DEP: held at the electrode edges", other: "negative DEP: carried out with the flow" },
      reK: { target: 0.62, other: -0.31 },
      rank: 1,
      score: 0.82,
      warnings: [{ code: "flow.shear", severity: "caution", message: "Flow above 3 µL/min may strip held cells.", value: 2, limit: 3, unit: "µL/min" }],
    },
    plan: {
      engineVersion: "1.0.0",
      seed: 42,
      request: { frequencies: { min: 1e3, max: 1e8, points: 60 }, conductivities: { min: 1e-3, max: 0.1, points: 20 } },
      result: {
        windows: [
          { rank: 1, conductivity: 0.0025, bandStart: 2e6, bandStop: 12e6, operatingPoint: { frequency: 5e6, conductivity: 0.0025 }, score: 0.82, recovery: 0.91, purity: 0.95 },
          { rank: 2, conductivity: 0.005, bandStart: 3e6, bandStop: 9e6, operatingPoint: { frequency: 5.5e6, conductivity: 0.005 }, score: 0.71, recovery: 0.86, purity: 0.92 },
        ],
      },
    },
  };
  return { ...base, ...overrides };
}
