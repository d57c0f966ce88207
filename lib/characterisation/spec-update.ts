/**
 * Puts a population fit's spreads into a population spec: radius, membrane C and G, interior σ and εr, each as
 * { mean, cv, distribution } (the single population model). Pure.
 */
import type { ParameterSpread } from "@/lib/fitting";
import type { PopulationSpec, SpreadParam } from "@/lib/populations/spec";
import { formatPercentFixed } from "@/lib/units/format";

/** Models whose membrane and interior are what a spectrum fit estimates (innermost membrane, core). */
export const CHARACTERISABLE_MODELS = ["single-shell", "walled"] as const;

/** Which spec field each fitted quantity goes to, in words (for the page and the provenance). */
export const SPEC_TARGET: Record<ParameterSpread["name"], string> = {
  radius: "radius",
  membraneCapacitance: "membrane capacitance",
  membraneConductance: "membrane conductance",
  cytoplasmConductivity: "interior (cytoplasm) conductivity",
  cytoplasmPermittivity: "interior (cytoplasm) permittivity",
};

/**
 * The spec with each spread put in; CVs above 1 are capped at 1 (the population model's limit) and reported.
 * @example applySpreads(spec, pop.spreads).spec.membrane?.capacitance // { mean, cv, distribution }
 */
export function applySpreads(spec: PopulationSpec, spreads: ParameterSpread[]): { spec: PopulationSpec; notes: string[] } {
  const notes: string[] = [];
  const next: PopulationSpec = structuredClone(spec);
  const param = (s: ParameterSpread): SpreadParam => {
    if (s.cv > 1) notes.push(`${SPEC_TARGET[s.name]}: CV ${formatPercentFixed(s.cv, 0)} capped at 100 %`);
    return { mean: s.mean, cv: Math.min(1, s.cv), distribution: s.distribution };
  };
  for (const s of spreads) {
    if (s.n < 2) continue;
    if (s.name === "radius") next.radius = param(s);
    else if (s.name === "cytoplasmConductivity") next.interior.conductivity = param(s);
    else if (s.name === "cytoplasmPermittivity") next.interior.permittivity = param(s);
    else if (next.membrane && s.name === "membraneCapacitance") next.membrane.capacitance = param(s);
    else if (next.membrane && s.name === "membraneConductance") next.membrane.conductance = param(s);
  }
  return { spec: next, notes };
}
