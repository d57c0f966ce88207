/**
 * Request schema of `planWindows` (zod). SI units throughout; the generator limit is given peak-to-peak (Vpp),
 * as function generators are labelled, and results report both Vrms and Vpp.
 *
 * A population's `spec` is checked by the one population schema (lib/populations/spec.ts), the same one the
 * population library, the protocol content and the public API use, so a saved population can be passed as-is.
 */
import { z } from "zod";
import { describeValue, LIMITS, mediumConductivitySchema, quantity } from "@/lib/dielectric";
import { mediumOsmolalitySchema, operatingTemperatureSchema } from "@/lib/buffers/schema";
import { plannerDeviceChecks, plannerDeviceShape } from "@/lib/devices/schema";
import { populationSpecSchema, type PopulationSpec, type SpreadParam } from "@/lib/populations/spec";
import { BUFFER_FIELDS } from "@/lib/buffers/fields";

/** The osmolality limits bound the medium osmolality, so they take its row of the buffer field table (osmol/kg). */
const OSMOLALITY = BUFFER_FIELDS.mediumOsmolality;

const populationSchema = z.object({
  id: z.string({ error: "population id must be text" }).min(1, { error: "population id must not be empty" }).max(200, { error: "population id must be at most 200 characters" }),
  name: z.string().max(200, { error: "population name must be at most 200 characters" }).optional(),
  spec: populationSpecSchema,
});

const gridOf = (what: string, value: ReturnType<typeof quantity>, maxPoints: number, unit: string) =>
  z
    .object(
      {
        start: value,
        stop: value,
        points: quantity({ what: `number of ${what} points`, range: `a whole number from 2 to ${maxPoints} (the planner's cap)`, min: 2, max: maxPoints, integer: true }),
      },
      { error: (iss) => `${what} range must be { start, stop, points } in ${unit} (got ${describeValue(iss.input)})` },
    )
    .superRefine((g, ctx) => {
      if (!(g.stop > g.start)) ctx.addIssue({ code: "custom", path: ["stop"], message: `${what} stop (${describeValue(g.stop)} ${unit}) must be greater than start (${describeValue(g.start)} ${unit})` });
    });

/** Caps on the planner's grid and sample sizes. */
export const PLANNER_LIMITS = {
  maxFrequencies: 241,
  maxConductivities: 121,
  minSamples: 20,
  maxSamples: 2000,
  /** Cells × grid points over both populations. */
  maxWork: 3e7,
} as const;

const frequency = quantity({ what: "frequency (Hz)", range: "from 1 Hz to 10 GHz", min: LIMITS.minFrequency, max: LIMITS.maxFrequency });

const conductivityOfWall = (what: string) =>
  quantity({ what: `${what} thermal conductivity (W/(m·K))`, range: "between 0.01 and 500 W/(m·K) (PDMS ≈ 0.15, glass ≈ 1.05, silicon ≈ 150)", min: 0.01, max: 500 });

/** Request schema of `planWindows`. */
export const windowsRequestSchema = z
  .object({
    populations: z
      .array(populationSchema, { error: (iss) => `populations must be a list of two (got ${describeValue(iss.input)})` })
      .length(2, { error: (iss) => `give exactly two populations, the one to collect and the other (got ${describeValue(iss.input)})` }),
    /** Population to collect (default: the first). */
    targetId: z.string().optional(),
    medium: z
      .object({
        /** Fixed conductivity at the operating temperature, S/m … */
        conductivity: mediumConductivitySchema.optional(),
        /** … or a log-spaced range to sweep, S/m. */
        conductivityRange: gridOf("conductivity", mediumConductivitySchema, PLANNER_LIMITS.maxConductivities, "S/m").optional(),
        permittivity: quantity({ what: "medium relative permittivity", range: "between 1 and 200", min: 1, max: 200 }).optional(),
        temperatureC: operatingTemperatureSchema.optional(),
        relativeViscosity: quantity({ what: "medium viscosity relative to water", range: "between 1 and 10", min: 1, max: 10 }).optional(),
        osmolality: mediumOsmolalitySchema.optional(),
      })
      .superRefine((m, ctx) => {
        if ((m.conductivity === undefined) === (m.conductivityRange === undefined)) {
          ctx.addIssue({ code: "custom", path: ["conductivity"], message: "give either a fixed medium conductivity (S/m) or a conductivityRange { start, stop, points }, not both or neither" });
        }
      }),
    frequencies: gridOf("frequency", frequency, PLANNER_LIMITS.maxFrequencies, "Hz").optional(),
    /** Electrodes, generator (limit and optional frequency range) and drive (lib/devices/schema.ts), plus the heating inputs. */
    device: z
      .object({
        ...plannerDeviceShape,
        /** Electrode array area for the array-heating estimate, m² (default 1 mm²). */
        electrodeArrayArea: quantity({ what: "electrode array area (m²)", range: "between 1e-9 and 1e-2 m² (0.001–10 000 mm²)", min: 1e-9, max: 1e-2 }).optional(),
        /** Thermal conductivity of the substrate under the electrodes and of the lid, W/(m·K) (defaults glass and PDMS). */
        substrateThermalConductivity: conductivityOfWall("substrate").optional(),
        lidThermalConductivity: conductivityOfWall("lid").optional(),
      })
      .superRefine((d, ctx) => {
        plannerDeviceChecks(d, ctx);
        const h = d.geometry.height;
        if (h !== undefined && !(h < d.channelHeight)) {
          ctx.addIssue({ code: "custom", path: ["geometry", "height"], message: `height above the electrodes (m) must lie inside the channel, from 0 up to below the channel height ${describeValue(d.channelHeight)} m (got ${describeValue(h)})` });
        }
      }),
    constraints: z
      .object({
        maxTemperatureRise: quantity({ what: "temperature-rise limit (K)", range: "greater than zero and at most 50 K", min: 0, max: 50, exclusiveMin: true }).optional(),
        maxElectrothermalRatio: quantity({ what: "electrothermal/DEP speed limit", range: "greater than zero and at most 1000", min: 0, max: 1000, exclusiveMin: true }).optional(),
        maxTransmembranePotential: quantity({ what: "transmembrane potential limit (V)", range: "greater than zero and at most 10 V", min: 0, max: 10, exclusiveMin: true }).optional(),
        maxAcElectroosmosis: z.enum(["unlikely", "possible", "likely"]).optional(),
        osmolalityMin: quantity({ what: "lowest osmolality (osmol/kg)", range: `between ${OSMOLALITY.min} and ${OSMOLALITY.max}`, min: OSMOLALITY.min, max: OSMOLALITY.max }).optional(),
        osmolalityMax: quantity({ what: "highest osmolality (osmol/kg)", range: `between ${OSMOLALITY.min} and ${OSMOLALITY.max}`, min: OSMOLALITY.min, max: OSMOLALITY.max }).optional(),
        minRecovery: quantity({ what: "minimum recovery", range: "between 0 and 1", min: 0, max: 1 }).optional(),
        minPurity: quantity({ what: "minimum purity", range: "between 0 and 1", min: 0, max: 1 }).optional(),
      })
      .optional(),
    separation: z
      .object({
        margin: quantity({ what: "Re[K] margin", range: "between 0 and 0.5", min: 0, max: 0.5 }).optional(),
        slowCellQuantile: quantity({ what: "slow-cell share", range: "between 0 and 0.5", min: 0, max: 0.5 }).optional(),
      })
      .optional(),
    sortDesign: z
      .discriminatedUnion("kind", [
        z.object({ kind: z.literal("capture"), captured: z.enum(["target", "other"]).optional() }),
        z.object({ kind: z.literal("opposite-deflection") }),
        z.object({ kind: z.literal("magnitude-deflection") }),
      ], { error: (iss) => `sortDesign must be { kind: "capture", captured?: "target" | "other" }, { kind: "opposite-deflection" } or { kind: "magnitude-deflection" } (got ${describeValue(iss.input)})` })
      .optional(),
    inputMix: z.object({ targetFraction: quantity({ what: "target share of the input", range: "greater than 0 and less than 1", min: 0, max: 1, exclusiveMin: true }) }).optional(),
    seed: quantity({ what: "seed", range: "a whole number from 0 to 4294967295", min: 0, max: 4294967295, integer: true }).optional(),
    samplesPerPopulation: quantity({ what: "samples per population", range: `a whole number from ${PLANNER_LIMITS.minSamples} to ${PLANNER_LIMITS.maxSamples}`, min: PLANNER_LIMITS.minSamples, max: PLANNER_LIMITS.maxSamples, integer: true }).optional(),
    topN: quantity({ what: "number of windows to return", range: "a whole number from 1 to 100", min: 1, max: 100, integer: true }).optional(),
  })
  .superRefine((r, ctx) => {
    const [a, b] = r.populations;
    if (a && b && a.id === b.id) ctx.addIssue({ code: "custom", path: ["populations", 1, "id"], message: `the two populations need different ids (both are ${JSON.stringify(a.id)})` });
    if (r.targetId !== undefined && !r.populations.some((p) => p.id === r.targetId)) {
      ctx.addIssue({ code: "custom", path: ["targetId"], message: `targetId ${JSON.stringify(r.targetId)} is not one of the population ids` });
    }
    const c = r.constraints;
    if (c?.osmolalityMin !== undefined && c?.osmolalityMax !== undefined && !(c.osmolalityMax > c.osmolalityMin)) {
      ctx.addIssue({ code: "custom", path: ["constraints", "osmolalityMax"], message: "highest osmolality must be above the lowest" });
    }
    const nf = r.frequencies?.points ?? 121;
    const nc = r.medium.conductivityRange?.points ?? 1;
    const work = 2 * (r.samplesPerPopulation ?? 500) * nf * nc;
    if (work > PLANNER_LIMITS.maxWork) {
      ctx.addIssue({ code: "custom", path: ["samplesPerPopulation"], message: `2 populations × ${r.samplesPerPopulation ?? 500} cells × ${nf} frequencies × ${nc} conductivities = ${work} cell-points; the cap is ${PLANNER_LIMITS.maxWork}` });
    }
  });

/** A `planWindows` request (see `windowsRequestSchema`). */
export type WindowsRequest = z.input<typeof windowsRequestSchema>;
/** A population's spec with spreads (lib/populations/spec.ts). */
export type { PopulationSpec };
/** A population in a request. */
export type PopulationEntry = z.infer<typeof populationSchema>;
/** One varying parameter: mean, coefficient of variation, distribution. */
export type SpreadParameter = SpreadParam;
