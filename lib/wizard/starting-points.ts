import { EPSILON_0, PARTICLE_PRESETS, type ParticleModel } from "@/lib/dielectric";
import { fromSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import type { ParamValues as ParamForm } from "@/lib/populations/form";
import { blankPopulation, type PopulationFormValues } from "./population-form";

/** A starting point the editor offers besides the library: the engine's presets with typical spreads. */
export interface StartingPoint {
  key: string;
  label: string;
  description: string;
  values: PopulationFormValues;
}

const p = (mean: number, cv: number, distribution: ParamForm["distribution"] = "normal"): ParamForm => ({ mean: tidy(mean, 6), cv, distribution });

/**
 * Editor values (lab units) for an engine preset model, with typical spreads: radius 10 %, capacitance 10 %,
 * conductance 30 % log-normal, conductivities 15 % (common practice, no source; edit to your cells). A bulk nuclear
 * envelope (εr, σ, d) becomes C = ε0·εr/d and G = σ/d.
 * @example modelToForm("Live", PARTICLE_PRESETS.mammalianViable.model).radius.mean // 3.5 (µm)
 */
export function modelToForm(name: string, m: ParticleModel): PopulationFormValues {
  const v = blankPopulation(name);
  v.radius = p(fromSI("um", m.radius), 10);
  if (m.kind === "bead" || m.kind === "homogeneous") {
    v.model = "homogeneous";
    v.interior = { permittivity: p(m.permittivity, 0), conductivity: p(m.kind === "bead" ? Math.max(m.bulkConductivity, 1e-6) : m.conductivity, 15) };
    v.surfaceConductance = m.kind === "bead" ? tidy(fromSI("nS", m.surfaceConductance), 6) : 0;
    return v;
  }
  v.model = m.kind === "singleShell" ? "single-shell" : m.kind;
  v.interior = { permittivity: p(m.cytoplasmPermittivity, 0), conductivity: p(m.cytoplasmConductivity, 15) };
  v.membrane = { thickness: tidy(fromSI("nm", m.membraneThickness), 6), capacitance: p(fromSI("uF_cm2", m.membraneCapacitance), 10), conductance: p(m.membraneConductance, 30, "lognormal") };
  if (m.kind === "walled") {
    v.wall = { thickness: p(fromSI("nm", m.wallThickness), 10), permittivity: p(m.wallPermittivity, 0), conductivity: p(fromSI("mS_m", m.wallConductivity), 15) };
  }
  if (m.kind === "nucleated") {
    v.nucleus = {
      radiusFraction: p((m.nucleusRadius / m.radius) * 100, 5),
      envelope: { thickness: tidy(fromSI("nm", m.envelopeThickness), 6), capacitance: p(fromSI("uF_cm2", (EPSILON_0 * m.envelopePermittivity) / m.envelopeThickness), 10), conductance: p(m.envelopeConductivity / m.envelopeThickness, 30, "lognormal") },
      nucleoplasm: { permittivity: p(m.nucleoplasmPermittivity, 0), conductivity: p(m.nucleoplasmConductivity, 15) },
    };
  }
  return v;
}

/** The engine's presets as editor starting points (typical textbook-scale values, from memory). */
export const STARTING_POINTS: StartingPoint[] = Object.entries(PARTICLE_PRESETS).map(([key, preset]) => ({
  key,
  label: preset.label,
  description: preset.description,
  values: modelToForm(preset.label, preset.model as ParticleModel),
}));
