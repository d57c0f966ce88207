/**
 * Generated example files of single-cell spectra, one per kind: invented live lymphocyte-like cells of the demo
 * scenario ("Quarry Hill Cell Therapy"), made by the engine's shell model with a natural spread and a little
 * measurement scatter (seeded, so the file is always the same). Not measured data.
 */
import { compileParticle, effectivePermittivityInto, imagCM, realCM, EPSILON_0, isomotiveField, rotationChamberField, type Particle } from "@/lib/dielectric";
import { mulberry32, normalSource } from "@/lib/planner/prng";
import { rotationPerImK, velocityPerReK } from "./conversions";
import type { SpectrumKind } from "./spectrum-schema";
import { csvNumber } from "@/lib/units/number";

/** The setup the example files were made with (SI): medium, devices and drive. */
export const EXAMPLE_SETUP = {
  medium: { conductivity: 0.01, permittivity: 78.3, viscosity: 1.2e-3 },
  /** Isomotive pair with the driven electrode 150 µm from the vertex (Γ = 9/(4R³) ≈ 6.67e11 m⁻³), 5 V rms. */
  isomotiveVertexDistance: 150e-6,
  voltageRms: 5,
  /** Four-electrode chamber, 400 µm tip to tip, 0.6 V per electrode: E0 ≈ 2V0/d = 3 kV/m. */
  tipDistance: 400e-6,
  electrodeVoltage: 0.6,
} as const;

/** The cells' true population (means; C and G log-normal, the rest normal): the answer a fit should find. */
export const EXAMPLE_TRUTH = {
  radius: { mean: 3.6e-6, cv: 0.08 },
  membraneCapacitance: { mean: 0.0095, cv: 0.1 },
  membraneConductance: { mean: 2, cv: 0.5 },
  cytoplasmConductivity: { mean: 0.45, cv: 0.1 },
  cytoplasmPermittivity: 60,
  membraneThickness: 7e-9,
} as const;

const HEADER: Record<SpectrumKind, string> = {
  "dep-velocity": "DEP velocity (µm/s)",
  "rotation-rate": "rotation rate (rad/s)",
  "re-k": "Re[K]",
  "im-k": "Im[K]",
  "relative-re-k": "relative Re[K] (px/frame)",
};

/**
 * An example CSV for `kind`: `cells` invented cells × `frequencies` log-spaced frequencies from 5 kHz to 50 MHz.
 * @example exampleCellsCsv("dep-velocity").split("\n")[0] // "cell,frequency (kHz),DEP velocity (µm/s),radius (µm)"
 */
export function exampleCellsCsv(kind: SpectrumKind, cells = 24, frequencies = 16): string {
  const uniform = mulberry32(15 + SPECTRUM_SEED[kind]);
  const z = normalSource(uniform);
  const t = EXAMPLE_TRUTH;
  const logn = (mean: number, cv: number) => {
    const s2 = Math.log(1 + cv * cv);
    return Math.exp(Math.log(mean) - s2 / 2 + Math.sqrt(s2) * z());
  };
  const freqs = Array.from({ length: frequencies }, (_, i) => 5e3 * 1e4 ** (i / (frequencies - 1)));
  const m = EXAMPLE_SETUP.medium;
  const gamma = isomotiveField(EXAMPLE_SETUP.isomotiveVertexDistance).gamma;
  const e0 = rotationChamberField(EXAMPLE_SETUP.tipDistance).fieldPerVolt * EXAMPLE_SETUP.electrodeVoltage;
  const lines = [["cell", "frequency (kHz)", HEADER[kind], "radius (µm)"].join(",")];
  const o = new Float64Array(2);
  for (let c = 0; c < cells; c++) {
    const radius = t.radius.mean * (1 + t.radius.cv * z());
    const p: Particle = {
      id: "cell",
      radius,
      core: { permittivity: t.cytoplasmPermittivity, conductivity: t.cytoplasmConductivity.mean * (1 + t.cytoplasmConductivity.cv * z()) },
      shells: [{ thickness: t.membraneThickness, capacitance: logn(t.membraneCapacitance.mean, t.membraneCapacitance.cv), conductance: logn(t.membraneConductance.mean, t.membraneConductance.cv) }],
    };
    const cp = compileParticle(p);
    const scale =
      kind === "dep-velocity"
        ? velocityPerReK({ radius, mediumPermittivity: m.permittivity, viscosity: m.viscosity, gamma, voltageRms: EXAMPLE_SETUP.voltageRms }) / 1e-6
        : kind === "rotation-rate"
          ? rotationPerImK({ mediumPermittivity: m.permittivity, viscosity: m.viscosity, fieldAmplitude: e0 })
          : kind === "relative-re-k"
            ? 8
            : 1;
    const id = `QH-L${String(c + 1).padStart(2, "0")}`;
    freqs.forEach((f, k) => {
      const w = 2 * Math.PI * f;
      effectivePermittivityInto(cp, w, o);
      const mi = -m.conductivity / (EPSILON_0 * w);
      const k0 = kind === "rotation-rate" || kind === "im-k" ? imagCM(o[0], o[1], m.permittivity, mi) : realCM(o[0], o[1], m.permittivity, mi);
      const value = scale * (k0 + 0.02 * z());
      lines.push([id, csvNumber(f / 1e3, 4), csvNumber(value, 4), k === 0 ? csvNumber(radius * 1e6, 3) : ""].join(","));
    });
  }
  return lines.join("\n") + "\n";
}

const SPECTRUM_SEED: Record<SpectrumKind, number> = { "dep-velocity": 1, "rotation-rate": 2, "re-k": 3, "im-k": 4, "relative-re-k": 5 };
