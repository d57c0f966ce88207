/**
 * zod schema of a crossover fit request (POST /api/v1/fits/crossovers): measured first crossovers and the options of
 * `fitMembrane`. SI units: S/m, Hz, m, F/m², S/m². `fitMembrane` checks every value again and names bad fields.
 */
import { z } from "zod";
import { quantity } from "@/lib/dielectric";
import { MAX_FIT_POINTS } from "./fit-input";

const positive = (what: string, max: number) => quantity({ what, range: `greater than zero and at most ${max}`, min: 0, max, exclusiveMin: true });
/** A cell radius: 0.1 µm to 1 mm. Below that the shell model's matrices degenerate (a 5e-324 m radius gave a 500). */
const radius = () => quantity({ what: "cell radius (m)", range: "between 0.1 µm and 1 mm (1e-7 to 1e-3 m)", min: 1e-7, max: 1e-3 });

export const crossoverFitRequestSchema = z.object({
  points: z
    .array(
      z.object({
        conductivity: positive("medium conductivity (S/m)", 100),
        crossoverFrequency: positive("crossover frequency (Hz)", 1e10),
        radius: radius().optional(),
      }),
    )
    .min(1, { error: "points: at least one crossover measurement is needed" })
    .max(MAX_FIT_POINTS, { error: `points: at most ${MAX_FIT_POINTS}` }),
  radius: radius().optional(),
  fitConductance: z.boolean().optional(),
  initial: z.object({ capacitance: z.number().optional(), conductance: z.number().optional() }).optional(),
  weighting: z.enum(["relative", "absolute"]).optional(),
  confidenceLevel: z.number().optional(),
  model: z.enum(["shell", "closed-form"], { error: 'model must be "shell" or "closed-form"' }).optional(),
  cytoplasm: z.object({ permittivity: z.number(), conductivity: z.number() }).optional(),
  membraneThickness: z.number().optional(),
  mediumPermittivity: z.number().optional(),
});
export type CrossoverFitRequest = z.infer<typeof crossoverFitRequestSchema>;
