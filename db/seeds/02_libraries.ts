import type { Knex } from "knex";
import { additionForTargetConductivity } from "../../lib/dielectric";
import type { BufferContent } from "../../lib/library/buffers/content";
import type { DeviceContent } from "../../lib/library/devices/content";
import type { PopulationContent } from "../../lib/library/populations/content";
import { insertNewItem, type Actor } from "../../lib/library/service";
import { findActiveUserByEmail } from "../../lib/users/repo";

/**
 * Demo libraries for the invented scenario of DESIGN.md: Larkspur Fermentation QC (viable vs heat-killed brewing
 * yeast, walled model) and Quarry Hill Cell Therapy (live vs dead lymphocyte-like cells, single shell), with buffers
 * and device profiles. All values are invented and plausible; none is taken from a published table.
 */

const sp = (mean: number, cv: number, distribution: "normal" | "lognormal" = "normal") => ({ mean, cv, distribution });

const yeastWall = { thickness: sp(240e-9, 0.12), permittivity: sp(58, 0.08), conductivity: sp(0.022, 0.2) };

export const DEMO_POPULATIONS: PopulationContent[] = [
  {
    name: "Larkspur viable brewing yeast",
    kind: "live",
    organisation: "Larkspur Fermentation QC",
    description: "Lager yeast from the propagation tank, washed twice in sugar buffer. Used as the target population for viability counts.",
    spec: { model: "walled", radius: sp(4.3e-6, 0.12), interior: { permittivity: sp(52, 0.06), conductivity: sp(0.24, 0.15) }, membrane: { thickness: 7.5e-9, capacitance: sp(0.0075, 0.1), conductance: sp(40, 0.35, "lognormal") }, wall: yeastWall },
  },
  {
    name: "Larkspur heat-killed brewing yeast",
    kind: "heat-killed",
    organisation: "Larkspur Fermentation QC",
    description: "Same strain held at 80 °C for 10 min: membrane permeabilised, cytoplasm ions leaked toward the medium.",
    spec: { model: "walled", radius: sp(4.1e-6, 0.13), interior: { permittivity: sp(52, 0.06), conductivity: sp(0.012, 0.3) }, membrane: { thickness: 7.5e-9, capacitance: sp(0.0072, 0.12), conductance: sp(6000, 0.5, "lognormal") }, wall: yeastWall },
  },
  {
    name: "Quarry Hill live lymphocytes",
    kind: "live",
    organisation: "Quarry Hill Cell Therapy",
    description: "Lymphocyte-like cells from the expansion line, before removal of dead cells.",
    spec: { model: "single-shell", radius: sp(3.6e-6, 0.08), interior: { permittivity: sp(64, 0.05), conductivity: sp(0.58, 0.1) }, membrane: { thickness: 7e-9, capacitance: sp(0.0108, 0.12), conductance: sp(160, 0.4, "lognormal") } },
  },
  {
    name: "Quarry Hill dead lymphocytes",
    kind: "dead",
    organisation: "Quarry Hill Cell Therapy",
    description: "Dead and dying cells of the same line (membrane leaky, smaller, cytoplasm depleted).",
    spec: { model: "single-shell", radius: sp(3.3e-6, 0.11), interior: { permittivity: sp(60, 0.06), conductivity: sp(0.07, 0.35) }, membrane: { thickness: 7e-9, capacitance: sp(0.0098, 0.15), conductance: sp(25000, 0.5, "lognormal") } },
  },
];

/** Millilitres of stock per litre of base that bring the sugar base to `target` S/m at 25 °C (the engine's inverse recipe). */
function stockFor(sucrose: number, glucose: number, kind: "PBS1x" | "KCl1M", target: number): number {
  const r = additionForTargetConductivity({ recipe: { volumeL: 1, temperatureC: 25, sucrosePercentWV: sucrose, glucosePercentWV: glucose, additions: [] }, kind, targetConductivity: target });
  return Math.round(("volumeL" in r.addition ? r.addition.volumeL : 0) * 1000 * 100) / 100;
}

function demoBuffers(): BufferContent[] {
  return [
    {
      name: "Isotonic sucrose–glucose, 10 mS/m",
      organisation: "Quarry Hill Cell Therapy",
      recipe: { sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", amountPerLitre: stockFor(8.5, 0.3, "PBS1x", 0.01) }] },
      targetConductivity25: 0.01,
      tolerance: 0.1,
      measured: { conductivity: 0.0098, temperatureC: 22.5 },
      osmolality: 0.291,
      maxMinutesInBuffer: 40,
      notes: "Made fresh each morning; filter 0.22 µm. Cells wait on ice, at most 40 min in buffer.",
    },
    {
      name: "Isotonic sucrose–glucose, 45 mS/m",
      organisation: "Quarry Hill Cell Therapy",
      recipe: { sucrosePercentWV: 8.2, glucosePercentWV: 0.3, additions: [{ kind: "PBS1x", amountPerLitre: stockFor(8.2, 0.3, "PBS1x", 0.045) }] },
      targetConductivity25: 0.045,
      tolerance: 0.08,
      measured: { conductivity: 0.0437, temperatureC: 23 },
      osmolality: 0.297,
      maxMinutesInBuffer: 45,
      notes: "Higher-conductivity variant for runs where heating is not limiting.",
    },
    {
      name: "Low-salt sucrose for yeast, 3 mS/m",
      organisation: "Larkspur Fermentation QC",
      recipe: { sucrosePercentWV: 9, glucosePercentWV: 0, additions: [{ kind: "KCl1M", amountPerLitre: stockFor(9, 0, "KCl1M", 0.003) }] },
      targetConductivity25: 0.003,
      tolerance: 0.15,
      measured: null,
      osmolality: null,
      maxMinutesInBuffer: 60,
      notes: "Yeast tolerate the low osmolality; measure conductivity before each run.",
    },
  ];
}

export const DEMO_DEVICES: DeviceContent[] = [
  {
    name: "Interdigitated chip, 40 µm electrodes",
    organisation: "Quarry Hill Cell Therapy",
    geometry: { kind: "interdigitated", electrodeWidth: 40e-6, electrodeGap: 40e-6, channelHeight: 60e-6 },
    generator: { maxVoltageVpp: 20, minFrequency: 1e3, maxFrequency: 20e6 },
    notes: "Gold on glass, 24 electrode pairs; bench generator with a 20 Vpp ceiling into the chip.",
  },
  {
    name: "Castellated chip, simulated Γ",
    organisation: "Larkspur Fermentation QC",
    geometry: { kind: "user-gradient", gradientFactor: 2.4e14, gradientSource: "own finite-element field map of the chip, averaged over 5–15 µm above the electrodes (Nov 2026)", electrodeGap: 25e-6, channelHeight: 50e-6 },
    generator: { maxVoltageVpp: 24, minFrequency: 10e3, maxFrequency: 40e6 },
    notes: "Castellated electrodes, 25 µm features. Γ pasted from the field simulation; re-check if the chip layout changes.",
  },
];

const STARTING_VALUES = "Starting values set by the assay developer from experience with similar cells; refine by fitting measured crossovers.";

export async function seed(knex: Knex): Promise<void> {
  const dana = await findActiveUserByEmail("dana.dev@example.test", knex);
  if (!dana) throw new Error("02_libraries needs the demo user dana.dev@example.test (01_users)");
  const actor: Actor = { id: Number(dana.id), email: dana.email };
  await knex.transaction(async (trx) => {
    for (const p of DEMO_POPULATIONS) await insertNewItem(trx, actor, "populations", p, { provenance: "assumed", provenanceSource: STARTING_VALUES, changeNote: "First entry for the demo scenario" });
    for (const b of demoBuffers())
      await insertNewItem(trx, actor, "buffers", b, { provenance: b.measured ? "measured" : "assumed", provenanceSource: b.measured ? "Conductivity meter (cell constant 1.0, calibrated against a KCl standard the same day)" : "Recipe prediction only; not yet measured", changeNote: "First entry for the demo scenario" });
    for (const d of DEMO_DEVICES) await insertNewItem(trx, actor, "devices", d, { provenance: d.geometry.kind === "user-gradient" ? "measured" : "assumed", provenanceSource: d.geometry.kind === "user-gradient" ? "Γ from the lab's own field simulation" : "Chip drawing dimensions; Γ from the interdigitated preset", changeNote: "First entry for the demo scenario" });
  });
}
