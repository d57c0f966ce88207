/**
 * What the characterisation page sends to save (SI units): the data file, the medium, where the field comes from,
 * the parameters to fit and the cells to leave out or keep. One schema for the page, the action and the service.
 */
import { z } from "zod";
import { FIT_PARAMETERS, MAX_CELLS } from "@/lib/fitting";

const num = (field: string, unit: string, min: number, max: number) => {
  const msg = `${field}: enter a number from ${min} to ${max} ${unit}.`;
  return z.number({ error: msg }).min(min, { error: msg }).max(max, { error: msg });
};

/** Where the field comes from: velocities need Γ and a voltage, rotation rates a rotating-field amplitude. */
export const deviceSetupSchema = z.discriminatedUnion(
  "source",
  [
    z.object({ source: z.literal("isomotive"), vertexDistance: num("Distance from the vertex to the driven electrode", "m", 1e-6, 0.1), voltageRms: num("Voltage", "V rms", 1e-3, 1000) }),
    z.object({ source: z.literal("library"), deviceId: z.number().int().positive({ error: "Device: choose a device from the library." }), voltageRms: num("Voltage", "V rms", 1e-3, 1000) }),
    z.object({ source: z.literal("gamma"), gamma: num("Γ", "m⁻³", 1, 1e25), voltageRms: num("Voltage", "V rms", 1e-3, 1000) }),
    z.object({
      source: z.literal("rotation-chamber"),
      tipDistance: num("Tip-to-tip distance", "m", 1e-6, 0.1),
      electrodeVoltage: num("Electrode voltage", "V", 1e-3, 1000),
      fieldPerVolt: num("Field per volt", "V/m per V", 1, 1e8).optional(),
    }),
    z.object({ source: z.literal("field"), rotatingFieldAmplitude: num("Rotating-field amplitude", "V/m", 1, 1e8) }),
    z.object({ source: z.literal("none") }),
  ],
  { error: "Device: choose where the field comes from." },
);
export type DeviceSetup = z.infer<typeof deviceSetupSchema>;

export const saveCharacterisationSchema = z.object({
  baseVersion: z.number().int().positive(),
  fileName: z.string().trim().min(1, { error: "File name: missing." }).max(255, { error: "File name: at most 255 characters." }),
  csvText: z.string().min(1, { error: "The file is empty." }),
  medium: z.object({
    conductivity: num("Medium conductivity", "S/m", 1e-6, 20),
    permittivity: num("Medium relative permittivity", "", 1, 200),
    viscosity: num("Medium viscosity", "Pa·s", 1e-4, 1),
  }),
  device: deviceSetupSchema,
  fit: z.array(z.enum(FIT_PARAMETERS)).min(1, { error: "Fit: choose at least one parameter." }).refine((a) => new Set(a).size === a.length, { error: "Fit: each parameter once." }),
  exclude: z.array(z.string().max(80)).max(MAX_CELLS).default([]),
  include: z.array(z.string().max(80)).max(MAX_CELLS).default([]),
  changeNote: z.string().trim().max(500, { error: "Change note: at most 500 characters." }).optional(),
});
export type SaveCharacterisationInput = z.input<typeof saveCharacterisationSchema>;
