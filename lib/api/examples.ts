/**
 * One example request per API route, shown on the API page, embedded in the OpenAPI document and run by the tests.
 * The particles are invented but plausible (demo data): lymphocyte-like cells, viable and membrane-compromised,
 * and a 5 µm polystyrene bead; the populations give those cells a natural spread. SI units throughout.
 */
import { CELLS_FIT_EXAMPLE, CROSSOVER_FIT_EXAMPLE } from "./fit-docs";

/** A viable lymphocyte-like cell: intact membrane (1 µF/cm² = 0.01 F/m², low conductance) around conductive cytoplasm. */
export const VIABLE_CELL = {
  id: "viable",
  radius: 3.6e-6,
  core: { permittivity: 60, conductivity: 0.45 },
  shells: [{ thickness: 7e-9, capacitance: 0.0095, conductance: 2 }],
};

/** A membrane-compromised cell: leaky membrane (conductance up by orders of magnitude), cytoplasm ions lost. */
export const COMPROMISED_CELL = {
  id: "compromised",
  radius: 3.3e-6,
  core: { permittivity: 60, conductivity: 0.04 },
  shells: [{ thickness: 7e-9, capacitance: 0.0095, conductance: 5000 }],
};

/** A 5 µm polystyrene bead; its conductivity is the surface term 2Ks/r with Ks = 1 nS (σ = 8e-4 S/m). */
export const POLYSTYRENE_BEAD = {
  id: "bead-5um",
  radius: 2.5e-6,
  core: { permittivity: 2.55, conductivity: 8e-4 },
  shells: [],
};

/** An example request for one route. */
export interface ApiExample {
  /** Route path, e.g. "/api/v1/spectra". */
  path: string;
  /** Short title for the API page and the OpenAPI example. */
  summary: string;
  /** What the example asks, in a sentence. */
  description: string;
  /** The JSON body. */
  body: Record<string, unknown>;
}

/** Spectra of viable and compromised cells in a low-conductivity sugar buffer (10 mS/m), 1 kHz – 100 MHz. */
export const SPECTRA_EXAMPLE: ApiExample = {
  path: "/api/v1/spectra",
  summary: "Viable and compromised cells in a 10 mS/m buffer",
  description:
    "Re[K] and Im[K] of a viable and a membrane-compromised single-shell cell from 1 kHz to 100 MHz (81 log-spaced points) in a medium of 0.01 S/m and relative permittivity 78, with their crossover frequencies.",
  body: {
    medium: { conductivity: 0.01, permittivity: 78 },
    frequencies: { start: 1e3, stop: 1e8, points: 81 },
    particles: [VIABLE_CELL, COMPROMISED_CELL],
  },
};

/** Sweep of a viable cell and a bead over 1 kHz – 1 GHz × 1 mS/m – 1 S/m. */
export const SWEEP_EXAMPLE: ApiExample = {
  path: "/api/v1/sweeps",
  summary: "Viable cell and polystyrene bead over frequency × conductivity",
  description:
    "Re[K] maps of a viable cell and a 5 µm polystyrene bead on 61 frequencies (1 kHz – 1 GHz) × 31 medium conductivities (0.001 – 1 S/m), medium relative permittivity 78.",
  body: {
    mediumPermittivity: 78,
    frequencies: { start: 1e3, stop: 1e9, points: 61 },
    conductivities: { start: 1e-3, stop: 1, points: 31 },
    particles: [VIABLE_CELL, POLYSTYRENE_BEAD],
  },
};

const spread = (mean: number, cv: number, distribution: "normal" | "lognormal" = "normal") => ({ mean, cv, distribution });

/** Viable cells with their natural spread (the viable cell above as the population mean). */
const VIABLE_POPULATION = {
  model: "single-shell",
  radius: spread(3.6e-6, 0.08),
  interior: { permittivity: spread(60, 0.05), conductivity: spread(0.45, 0.1) },
  membrane: { thickness: 7e-9, capacitance: spread(0.0095, 0.1), conductance: spread(2, 0.5, "lognormal") },
};

/** Membrane-compromised cells with their spread. */
const COMPROMISED_POPULATION = {
  model: "single-shell",
  radius: spread(3.3e-6, 0.1),
  interior: { permittivity: spread(60, 0.05), conductivity: spread(0.04, 0.3, "lognormal") },
  membrane: { thickness: 7e-9, capacitance: spread(0.0095, 0.1), conductance: spread(5000, 0.5, "lognormal") },
};

const WINDOWS_BODY = {
  populations: [
    { id: "viable", name: "Viable cells", spec: VIABLE_POPULATION },
    { id: "compromised", name: "Membrane-compromised cells", spec: COMPROMISED_POPULATION },
  ],
  targetId: "viable",
  medium: { conductivityRange: { start: 1e-3, stop: 0.1, points: 21 }, permittivity: 78.3, temperatureC: 25, osmolality: 0.29 },
  frequencies: { start: 1e4, stop: 1e8, points: 61 },
  device: {
    geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6 },
    maxVoltageVpp: 20,
    channelHeight: 50e-6,
  },
  sortDesign: { kind: "opposite-deflection" },
  seed: 42,
  samplesPerPopulation: 200,
  topN: 3,
};

/** Operating windows for viable vs compromised cells on interdigitated electrodes. */
export const WINDOWS_EXAMPLE: ApiExample = {
  path: "/api/v1/windows",
  summary: "Viable vs compromised cells, opposite-direction deflection",
  description:
    "Collect viable cells away from membrane-compromised ones with 20 µm interdigitated electrodes (20 Vpp generator, 50 µm channel), in a 290 mOsm/kg sugar buffer whose conductivity is swept from 1 to 100 mS/m; 200 cells drawn per population with seed 42; the best 3 windows.",
  body: WINDOWS_BODY,
};

/** Sensitivity of one window of the windows example. */
export const SENSITIVITY_EXAMPLE: ApiExample = {
  path: "/api/v1/windows/sensitivity",
  summary: "Which cell parameter the 0.1 S/m window depends on",
  description:
    "Shifts each varying parameter of both populations by ±1 standard deviation and reports how far the edges of the window at 0.1 S/m, 1 – 63 MHz move, and which parameter matters most.",
  body: { request: WINDOWS_BODY, window: { conductivity: 0.1, bandStart: 1e6, bandStop: 6.3e7 } },
};

/** Every example, in the order the API page shows them. */
export const API_EXAMPLES: ApiExample[] = [SPECTRA_EXAMPLE, SWEEP_EXAMPLE, WINDOWS_EXAMPLE, SENSITIVITY_EXAMPLE, CROSSOVER_FIT_EXAMPLE, CELLS_FIT_EXAMPLE];
