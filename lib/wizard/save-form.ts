import { z } from "zod";

/** Step 6 form: what the protocol is called and why, where it goes, and the bench handling details. */
export const saveStepSchema = z
  .object({
    title: z.string().trim().min(3, { error: "Title: 3 to 200 characters." }).max(200, { error: "Title: 3 to 200 characters." }),
    purpose: z.string().trim().min(3, { error: "Purpose: say in a sentence what the sort is for (3 to 2000 characters)." }).max(2000, { error: "Purpose: at most 2000 characters." }),
    destination: z.enum(["new", "existing"], { error: "Choose a new protocol or a new version of an existing one." }),
    protocolId: z.number({ error: "Protocol: choose the protocol to add a version to." }).int().positive().nullable(),
    washes: z.number({ error: "Washes before resuspension: a whole number from 0 to 10." }).int({ error: "Washes before resuspension: a whole number from 0 to 10." }).min(0, { error: "Washes before resuspension: a whole number from 0 to 10." }).max(10, { error: "Washes before resuspension: a whole number from 0 to 10." }),
    resuspensionMillionsPerMl: z.number({ error: "Resuspension density (million cells/mL): a number above 0 and at most 1000." }).gt(0, { error: "Resuspension density (million cells/mL): a number above 0 and at most 1000." }).max(1000, { error: "Resuspension density (million cells/mL): a number above 0 and at most 1000." }),
    notes: z.string().max(2000, { error: "Preparation notes: at most 2000 characters." }),
  })
  .superRefine((v, ctx) => {
    if (v.destination === "existing" && !v.protocolId) ctx.addIssue({ code: "custom", path: ["protocolId"], message: "Protocol: choose the protocol to add a version to." });
  });
export type SaveStepValues = z.input<typeof saveStepSchema>;

/** Sensible starting values for the save form. */
export function defaultSave(title: string): SaveStepValues {
  return { title: title === "Untitled plan" ? "" : title, purpose: "", destination: "new", protocolId: null, washes: 2, resuspensionMillionsPerMl: 5, notes: "Wash in DEP buffer, resuspend gently, keep on ice until loading." };
}
