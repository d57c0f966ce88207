import { z } from "zod";
import { interdigitatedField } from "@/lib/dielectric";
import { formatIn, fromSI, toSI } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";
import { DEVICE_FIELDS as F } from "@/lib/devices/fields";
import { GAMMA_SOURCE_LENGTH, GAMMA_SOURCE_MESSAGE, GEOMETRIES } from "@/lib/devices/form";
import { frequencyRangeIssue } from "@/lib/devices/schema";
import { outOfRangeMessage } from "@/lib/units/lab-fields";
import { labSchema, siNumber } from "@/lib/units/quantity-field";
import { nameSchema, notesSchema, organisationSchema, versionMetaFormSchema } from "../schemas";
import type { DisplayRow } from "../populations/content";

export const GEOMETRY_KINDS = ["interdigitated", "user-gradient"] as const;
export type GeometryKind = (typeof GEOMETRY_KINDS)[number];
export const GEOMETRY_LABELS: Record<GeometryKind, string> = {
  interdigitated: "Interdigitated electrodes (preset)",
  "user-gradient": "Own field-gradient factor Γ",
};


/** The stored content of one device-profile version. SI: m, m⁻³, V, Hz. */
export const deviceContentSchema = z
  .object({
    name: nameSchema,
    organisation: organisationSchema.default(""),
    geometry: z.discriminatedUnion("kind", [
      z.object({ kind: z.literal("interdigitated"), electrodeWidth: siNumber(F.electrodeWidth), electrodeGap: siNumber(F.electrodeGap), channelHeight: siNumber(F.channelHeight) }),
      z.object({ kind: z.literal("user-gradient"), gradientFactor: siNumber(F.gradientFactor), gradientSource: z.string().trim().min(GAMMA_SOURCE_LENGTH.min).max(GAMMA_SOURCE_LENGTH.max), electrodeGap: siNumber(F.electrodeGap), channelHeight: siNumber(F.channelHeight) }),
    ]),
    generator: z.object({ maxVoltageVpp: siNumber(F.maxVoltageVpp), minFrequency: siNumber(F.minFrequency), maxFrequency: siNumber(F.maxFrequency) }),
    notes: notesSchema.default(""),
  })
  .superRefine((d, ctx) => {
    const issue = frequencyRangeIssue(d.generator);
    if (issue) ctx.addIssue({ code: "custom", path: ["generator", "maxFrequency"], message: issue });
  });
export type DeviceContent = z.infer<typeof deviceContentSchema>;

/**
 * The device form in lab units (µm, m⁻³, Vpp, kHz, MHz), for the browser and the server action. Its keys are those
 * of DeviceFormValues (lib/devices/form.ts), which the planner's device step shares, so the one device editor
 * serves both.
 */
export const deviceFormSchema = versionMetaFormSchema
  .extend({
    name: nameSchema,
    organisation: organisationSchema,
    geometry: z.enum(GEOMETRIES, { error: "Geometry: choose the preset or your own Γ." }),
    electrodeWidth: labSchema(F.electrodeWidth).optional(),
    electrodeGap: labSchema(F.electrodeGap),
    channelHeight: labSchema(F.channelHeight),
    gamma: labSchema(F.gradientFactor).optional(),
    gammaSource: z.string().trim().max(GAMMA_SOURCE_LENGTH.max, { error: GAMMA_SOURCE_MESSAGE }),
    maxVoltageVpp: labSchema(F.maxVoltageVpp),
    minFrequency: labSchema(F.minFrequency),
    maxFrequency: labSchema(F.maxFrequency),
    notes: notesSchema,
  })
  .superRefine((f, ctx) => {
    if (f.geometry === "interdigitated" && f.electrodeWidth === undefined)
      ctx.addIssue({ code: "custom", path: ["electrodeWidth"], message: outOfRangeMessage(F.electrodeWidth) });
    if (f.geometry === "user" && f.gamma === undefined)
      ctx.addIssue({ code: "custom", path: ["gamma"], message: outOfRangeMessage(F.gradientFactor) });
    if (f.geometry === "user" && f.gammaSource.length < GAMMA_SOURCE_LENGTH.min)
      ctx.addIssue({ code: "custom", path: ["gammaSource"], message: GAMMA_SOURCE_MESSAGE });
    const issue = frequencyRangeIssue({ minFrequency: toSI(F.minFrequency.unit, f.minFrequency), maxFrequency: toSI(F.maxFrequency.unit, f.maxFrequency) });
    if (issue) ctx.addIssue({ code: "custom", path: ["maxFrequency"], message: `Highest generator frequency (MHz): ${issue}.` });
  });
export type DeviceForm = z.input<typeof deviceFormSchema>;

/** Converts a checked device form (lab units) to stored content (SI). */
export function deviceFormToContent(f: z.output<typeof deviceFormSchema>): DeviceContent {
  const si = (key: "electrodeWidth" | "electrodeGap" | "channelHeight" | "gradientFactor" | "minFrequency" | "maxFrequency", v: number) => tidy(toSI(F[key].unit, v), 12);
  const geometry: DeviceContent["geometry"] =
    f.geometry === "interdigitated"
      ? { kind: "interdigitated", electrodeWidth: si("electrodeWidth", f.electrodeWidth!), electrodeGap: si("electrodeGap", f.electrodeGap), channelHeight: si("channelHeight", f.channelHeight) }
      : { kind: "user-gradient", gradientFactor: si("gradientFactor", f.gamma!), gradientSource: f.gammaSource, electrodeGap: si("electrodeGap", f.electrodeGap), channelHeight: si("channelHeight", f.channelHeight) };
  return {
    name: f.name,
    organisation: f.organisation,
    geometry,
    generator: { maxVoltageVpp: f.maxVoltageVpp, minFrequency: si("minFrequency", f.minFrequency), maxFrequency: si("maxFrequency", f.maxFrequency) },
    notes: f.notes,
  };
}

/** Form values for a stored device (SI → lab units). */
export function deviceContentToForm(c: DeviceContent): Omit<DeviceForm, "provenanceKind" | "provenanceSource" | "changeNote" | "mode"> {
  const g = c.geometry;
  const lab = (key: "electrodeWidth" | "electrodeGap" | "channelHeight" | "gradientFactor" | "minFrequency" | "maxFrequency", v: number) => tidy(fromSI(F[key].unit, v));
  return {
    name: c.name,
    organisation: c.organisation,
    geometry: g.kind === "interdigitated" ? "interdigitated" : "user",
    electrodeWidth: g.kind === "interdigitated" ? lab("electrodeWidth", g.electrodeWidth) : undefined,
    electrodeGap: lab("electrodeGap", g.electrodeGap),
    channelHeight: lab("channelHeight", g.channelHeight),
    gamma: g.kind === "user-gradient" ? lab("gradientFactor", g.gradientFactor) : undefined,
    gammaSource: g.kind === "user-gradient" ? g.gradientSource : "",
    maxVoltageVpp: c.generator.maxVoltageVpp,
    minFrequency: lab("minFrequency", c.generator.minFrequency),
    maxFrequency: lab("maxFrequency", c.generator.maxFrequency),
    notes: c.notes,
  };
}

/**
 * Γ (m⁻³) the planner uses for this device and where it comes from: the interdigitated preset evaluated half a gap
 * above the electrodes, or the user's own value.
 * @example deviceGradient(content) // { gamma: 6.6e13, source: "interdigitated preset …" }
 */
export function deviceGradient(c: DeviceContent): { gamma: number; source: string } {
  const g = c.geometry;
  if (g.kind === "user-gradient") return { gamma: g.gradientFactor, source: `user value: ${g.gradientSource}` };
  const field = interdigitatedField(g.electrodeWidth, g.electrodeGap);
  return { gamma: field.gamma, source: `interdigitated preset, evaluated ${formatIn("um", g.electrodeGap / 2, 3)} above the electrode plane (fundamental Fourier mode; larger near the edges)` };
}

/** Display rows of a device in lab units (also the unit of the version diff). */
export function describeDevice(c: DeviceContent): DisplayRow[] {
  const g = c.geometry;
  const rows: DisplayRow[] = [
    { key: "name", label: "Name", value: c.name },
    { key: "organisation", label: "Organisation or project", value: c.organisation || "—" },
    { key: "geometry", label: "Geometry", value: GEOMETRY_LABELS[g.kind] },
  ];
  if (g.kind === "interdigitated") rows.push({ key: "electrodeWidth", label: "Electrode width", value: formatIn("um", g.electrodeWidth) });
  rows.push({ key: "electrodeGap", label: "Electrode gap", value: formatIn("um", g.electrodeGap) });
  rows.push({ key: "channelHeight", label: "Channel height", value: formatIn("um", g.channelHeight) });
  const grad = deviceGradient(c);
  rows.push({ key: "gamma", label: "Field-gradient factor Γ", value: `${formatIn("per_m3", grad.gamma, 3)} — ${grad.source}` });
  rows.push({ key: "maxVoltage", label: "Generator limit", value: formatIn("Vpp", c.generator.maxVoltageVpp) });
  rows.push({ key: "frequencyRange", label: "Frequency range", value: `${formatIn("kHz", c.generator.minFrequency)} to ${formatIn("MHz", c.generator.maxFrequency)}` });
  rows.push({ key: "notes", label: "Notes", value: c.notes || "—" });
  return rows;
}
