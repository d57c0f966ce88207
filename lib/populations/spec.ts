import { z } from "zod";

/**
 * A population of cells or beads: a shell model whose parameters each have a mean and a spread.
 * SI units throughout (m, S/m, F/m², S/m², relative permittivity). Lab units are converted at the UI edge only.
 * This one schema is shared by the population library, the planner wizard and the protocol snapshot.
 */

/** How a parameter varies across the population. */
export const DISTRIBUTIONS = ["normal", "lognormal"] as const;

/** A parameter with its natural spread: mean, coefficient of variation (0 = none, 0.1 = 10 %), distribution. */
export const spreadParamSchema = (field: string, unit: string, min: number, max: number) =>
  z.object({
    mean: z
      .number({ error: `${field}: enter a number in ${unit}.` })
      .refine(Number.isFinite, { error: `${field}: must be a finite number.` })
      .refine((v) => v >= min && v <= max, { error: `${field}: must be between ${min} and ${max} ${unit}.` }),
    cv: z
      .number({ error: `${field} spread: enter a coefficient of variation between 0 and 1 (0.1 = 10 %).` })
      .min(0, { error: `${field} spread: the coefficient of variation cannot be negative.` })
      .max(1, { error: `${field} spread: the coefficient of variation must be at most 1 (100 %).` }),
    distribution: z.enum(DISTRIBUTIONS).default("normal"),
  });
export type SpreadParam = z.infer<ReturnType<typeof spreadParamSchema>>;

const thin = (label: string) =>
  z.object({
    thickness: z.number().min(1e-9, { error: `${label} thickness: between 1 nm and 100 nm.` }).max(100e-9, {
      error: `${label} thickness: between 1 nm and 100 nm.`,
    }),
    capacitance: spreadParamSchema(`${label} capacitance`, "F/m²", 1e-4, 0.2),
    conductance: spreadParamSchema(`${label} conductance`, "S/m²", 0, 1e7),
  });

const body = (label: string) =>
  z.object({
    permittivity: spreadParamSchema(`${label} permittivity`, "(relative)", 1, 200),
    conductivity: spreadParamSchema(`${label} conductivity`, "S/m", 1e-6, 20),
  });

/** The shell models offered (DESIGN/PHYSICS §2). */
export const SHELL_MODELS = ["homogeneous", "single-shell", "walled", "nucleated"] as const;
export type ShellModel = (typeof SHELL_MODELS)[number];

/** The population's dielectric model with spreads. Which optional parts are required depends on `model`. */
export const populationSpecSchema = z
  .object({
    model: z.enum(SHELL_MODELS, { error: `Model: one of ${SHELL_MODELS.join(", ")}.` }),
    radius: spreadParamSchema("Radius", "m", 0.1e-6, 100e-6),
    /** Interior (cytoplasm, or the bead's bulk). */
    interior: body("Interior"),
    /** Bead surface conductance Ks in S (homogeneous model only; adds 2Ks/r to the bulk conductivity). */
    surfaceConductance: z.number().min(0).max(1e-7).optional(),
    membrane: thin("Membrane").optional(),
    wall: z
      .object({
        thickness: spreadParamSchema("Wall thickness", "m", 5e-9, 2e-6),
        permittivity: spreadParamSchema("Wall permittivity", "(relative)", 1, 200),
        conductivity: spreadParamSchema("Wall conductivity", "S/m", 1e-6, 20),
      })
      .optional(),
    nucleus: z
      .object({
        radiusFraction: spreadParamSchema("Nucleus radius fraction", "(of cell radius)", 0.1, 0.95),
        envelope: thin("Nuclear envelope"),
        nucleoplasm: body("Nucleoplasm"),
      })
      .optional(),
  })
  .superRefine((p, ctx) => {
    const need = (key: "membrane" | "wall" | "nucleus") => {
      if (!p[key]) ctx.addIssue({ code: "custom", path: [key], message: `${p.model} model: the ${key} parameters are required.` });
    };
    if (p.model !== "homogeneous") need("membrane");
    if (p.model === "walled") need("wall");
    if (p.model === "nucleated") need("nucleus");
  });
export type PopulationSpec = z.infer<typeof populationSpecSchema>;

/** Shape of an engine particle (lib/dielectric contract): outer radius, core, shells outermost first. */
export interface ParticleShape {
  id: string;
  radius: number;
  core: { permittivity: number; conductivity: number };
  shells: ({ thickness: number; permittivity: number; conductivity: number } | { thickness: number; capacitance: number; conductance: number })[];
}

/** Picks a parameter's value: the mean, or a drawn value supplied by `draw`. */
export type Draw = (param: SpreadParam, name: string) => number;
const meanOf: Draw = (p) => p.mean;

/**
 * Maps a population spec to one engine particle, using the means (or values from `draw`, for sampling spreads).
 * Walled: core = interior, shells = [wall, membrane]. Nucleated: core = nucleoplasm, shells = [membrane, cytoplasm
 * layer, nuclear envelope] — the cytoplasm layer runs from the nucleus out to the inner face of the membrane.
 * @example toParticle("live", spec).shells.length // 1 for a single-shell cell
 */
export function toParticle(id: string, spec: PopulationSpec, draw: Draw = meanOf): ParticleShape {
  const radius = draw(spec.radius, "radius");
  const interior = { permittivity: draw(spec.interior.permittivity, "interior.permittivity"), conductivity: draw(spec.interior.conductivity, "interior.conductivity") };
  const membrane = spec.membrane && {
    thickness: spec.membrane.thickness,
    capacitance: draw(spec.membrane.capacitance, "membrane.capacitance"),
    conductance: draw(spec.membrane.conductance, "membrane.conductance"),
  };
  switch (spec.model) {
    case "homogeneous": {
      const ks = spec.surfaceConductance ?? 0;
      return { id, radius, core: { ...interior, conductivity: interior.conductivity + (2 * ks) / radius }, shells: [] };
    }
    case "single-shell":
      return { id, radius, core: interior, shells: [membrane!] };
    case "walled": {
      const w = spec.wall!;
      const wall = { thickness: draw(w.thickness, "wall.thickness"), permittivity: draw(w.permittivity, "wall.permittivity"), conductivity: draw(w.conductivity, "wall.conductivity") };
      return { id, radius, core: interior, shells: [wall, membrane!] };
    }
    case "nucleated": {
      const n = spec.nucleus!;
      const nucleusRadius = radius * draw(n.radiusFraction, "nucleus.radiusFraction");
      const envelope = { thickness: n.envelope.thickness, capacitance: draw(n.envelope.capacitance, "nucleus.envelope.capacitance"), conductance: draw(n.envelope.conductance, "nucleus.envelope.conductance") };
      const cytoplasmLayer = { thickness: radius - membrane!.thickness - nucleusRadius, ...interior };
      const core = { permittivity: draw(n.nucleoplasm.permittivity, "nucleus.nucleoplasm.permittivity"), conductivity: draw(n.nucleoplasm.conductivity, "nucleus.nucleoplasm.conductivity") };
      return { id, radius, core, shells: [membrane!, cytoplasmLayer, envelope] };
    }
  }
}
