/**
 * The request of `fitCellSpectrum`: one cell's measured spectrum, the setup that turns it into K, the starting
 * particle and the parameters to fit. SI units: Hz, m, S/m, Pa·s, m⁻³, V, V/m; values per `kind` (see SPECTRUM_KINDS).
 */
import { z } from "zod";
import { describeValue, isMembrane, particleSchema, quantity } from "@/lib/dielectric";
import { populationField } from "@/lib/populations/fields";
import { siRangeText } from "@/lib/units/quantity-field";

/** A cell radius as the population field table bounds it. */
const RADIUS = populationField("radius")!;

/**
 * What the measured values are:
 * - "dep-velocity": DEP velocity in m/s along ∇|E|² (positive = towards stronger field); needs `field.gamma` and `field.voltageRms`;
 * - "rotation-rate": rotation rate in rad/s, positive in the field's sense of rotation; needs `field.rotatingFieldAmplitude`;
 * - "re-k", "im-k": Re[K] or Im[K], dimensionless;
 * - "relative-re-k": Re[K] times an unknown positive scale (any unit); the scale is fitted too.
 */
export const SPECTRUM_KINDS = ["dep-velocity", "rotation-rate", "re-k", "im-k", "relative-re-k"] as const;
export type SpectrumKind = (typeof SPECTRUM_KINDS)[number];

/** Parameters a spectrum fit can estimate: the innermost membrane shell's C (F/m²) and G (S/m²), the core's σ (S/m) and εr. */
export const FIT_PARAMETERS = ["membraneCapacitance", "membraneConductance", "cytoplasmConductivity", "cytoplasmPermittivity"] as const;
export type FitParameterName = (typeof FIT_PARAMETERS)[number];

/** Most frequencies one cell's spectrum may have. */
export const MAX_SPECTRUM_POINTS = 400;

const point = z.object({
  frequency: quantity({ what: "frequency (Hz)", range: "from 1 Hz to 10 GHz", min: 1, max: 1e10 }),
  value: z.number({ error: (iss) => `measured value must be a finite number (got ${describeValue(iss.input)})` }).refine(Number.isFinite, {
    error: "measured value must be a finite number",
  }),
});

const gradientField = z.strictObject({
  gamma: quantity({ what: "field-gradient factor Γ (m⁻³)", range: "greater than zero and at most 1e25 m⁻³", min: 0, max: 1e25, exclusiveMin: true }),
  voltageRms: quantity({ what: "applied voltage (V rms)", range: "greater than zero and at most 1000 V", min: 0, max: 1000, exclusiveMin: true }),
});

const rotatingField = z.strictObject({
  rotatingFieldAmplitude: quantity({ what: "rotating-field amplitude E0 (V/m)", range: "greater than zero and at most 1e8 V/m", min: 0, max: 1e8, exclusiveMin: true }),
});

/** zod schema of `fitCellSpectrum`'s request. */
export const cellSpectrumRequestSchema = z
  .object({
    kind: z.enum(SPECTRUM_KINDS, { error: (iss) => `kind must be one of ${SPECTRUM_KINDS.join(", ")} (got ${describeValue(iss.input)})` }),
    points: z
      .array(point, { error: (iss) => `points must be a list of { frequency, value } (got ${describeValue(iss.input)})` })
      .min(2, { error: "points: a spectrum needs at least 2 frequencies" })
      .max(MAX_SPECTRUM_POINTS, { error: `points: at most ${MAX_SPECTRUM_POINTS} frequencies per cell` }),
    radius: quantity({ what: "cell radius (m)", range: siRangeText(RADIUS), min: RADIUS.min, max: RADIUS.max }),
    medium: z.object({
      conductivity: quantity({ what: "medium conductivity (S/m)", range: "between 1e-6 and 20 S/m", min: 1e-6, max: 20 }),
      permittivity: quantity({ what: "medium relative permittivity", range: "between 1 and 200", min: 1, max: 200 }),
      viscosity: quantity({ what: "medium viscosity (Pa·s)", range: "between 1e-4 and 1 Pa·s (water is 8.9e-4)", min: 1e-4, max: 1 }).optional(),
    }),
    field: z.union([gradientField, rotatingField], { error: "field must be { gamma, voltageRms } or { rotatingFieldAmplitude }" }).optional(),
    particle: particleSchema,
    fit: z
      .array(z.enum(FIT_PARAMETERS, { error: (iss) => `fit: each entry must be one of ${FIT_PARAMETERS.join(", ")} (got ${describeValue(iss.input)})` }))
      .min(1, { error: "fit: choose at least one parameter to fit" })
      .max(FIT_PARAMETERS.length)
      .refine((a) => new Set(a).size === a.length, { error: "fit: each parameter may be listed once" }),
  })
  .superRefine((req, ctx) => {
    if (req.kind === "dep-velocity" && !(req.field && "gamma" in req.field))
      ctx.addIssue({ code: "custom", path: ["field"], message: "dep-velocity needs field { gamma (m⁻³), voltageRms (V) } to turn velocities into Re[K]" });
    if (req.kind === "rotation-rate" && !(req.field && "rotatingFieldAmplitude" in req.field))
      ctx.addIssue({ code: "custom", path: ["field"], message: "rotation-rate needs field { rotatingFieldAmplitude (V/m) } to turn rates into Im[K]" });
    const wantsMembrane = req.fit.some((f) => f === "membraneCapacitance" || f === "membraneConductance");
    if (wantsMembrane && !req.particle.shells.some(isMembrane))
      ctx.addIssue({ code: "custom", path: ["particle", "shells"], message: "fitting the membrane needs a shell given as { thickness, capacitance, conductance } in the particle" });
    const freqs = new Set(req.points.map((p) => p.frequency));
    if (freqs.size < 2) ctx.addIssue({ code: "custom", path: ["points"], message: "points: the spectrum needs at least 2 different frequencies" });
  });

export type CellSpectrumRequest = z.infer<typeof cellSpectrumRequestSchema>;
