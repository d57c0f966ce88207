/** Request builders for the planner tests. */
import type { PopulationSpec, WindowsRequest } from "@/lib/planner";

type Dist = "normal" | "lognormal";
export const spread = (mean: number, cv = 0, distribution: Dist = "normal") => ({ mean, cv, distribution });

/** A homogeneous sphere (bead-like) with no spread unless given. */
export function sphere(radius: number, permittivity: number, conductivity: number, cv = 0): PopulationSpec {
  return { model: "homogeneous", radius: spread(radius, cv), interior: { permittivity: spread(permittivity, cv), conductivity: spread(conductivity, cv) } };
}

/** A single-shell cell with 10 % spreads (typical values, from memory). */
export function cell(opts: { radius: number; cytoplasmConductivity: number; conductance: number; cv?: number }): PopulationSpec {
  const cv = opts.cv ?? 0.1;
  return {
    model: "single-shell",
    radius: spread(opts.radius, cv),
    interior: { permittivity: spread(60, cv), conductivity: spread(opts.cytoplasmConductivity, cv) },
    membrane: { thickness: 7e-9, capacitance: spread(0.01, cv), conductance: spread(opts.conductance, 0.5, "lognormal") },
  };
}

/** A live/dead-like request over a modest grid. */
export function liveDeadRequest(over: Partial<WindowsRequest> = {}): WindowsRequest {
  return {
    populations: [
      { id: "live", spec: cell({ radius: 3.5e-6, cytoplasmConductivity: 0.5, conductance: 1 }) },
      { id: "dead", spec: cell({ radius: 3.3e-6, cytoplasmConductivity: 0.05, conductance: 1e4 }) },
    ],
    medium: { conductivityRange: { start: 1e-3, stop: 0.3, points: 7 } },
    frequencies: { start: 1e3, stop: 1e9, points: 37 },
    device: { geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6 }, maxVoltageVpp: 10, channelHeight: 50e-6 },
    samplesPerPopulation: 150,
    seed: 11,
    topN: 100,
    ...over,
  };
}
