import { z } from "zod";

/** Where a library item's values come from. */
export const PROVENANCE_KINDS = ["measured", "fitted", "assumed"] as const;
export type ProvenanceKind = (typeof PROVENANCE_KINDS)[number];

/** On-screen words for each provenance. */
export const PROVENANCE_LABELS: Record<ProvenanceKind, string> = {
  measured: "Measured",
  fitted: "Fitted from data",
  assumed: "Assumed (literature or estimate)",
};

/** Provenance a user states by hand; "fitted" is set only by the crossover fit, which stores the data and result. */
export const provenanceSchema = z.object({
  kind: z.enum(PROVENANCE_KINDS, { error: "Provenance: choose measured, fitted or assumed." }),
  source: z.string().trim().max(2000, { error: "Source: at most 2000 characters." }),
});
export type Provenance = z.infer<typeof provenanceSchema>;

/** A stored fit: the MembraneFit result of lib/fitting plus the file it came from and what was dropped. */
export const fitProvenanceSchema = z.object({
  result: z.record(z.string(), z.unknown()),
  dataFileName: z.string().min(1).max(255),
  dataFileText: z.string(),
});
export type FitProvenance = z.infer<typeof fitProvenanceSchema>;

/** A change note: why this version exists. */
export const changeNoteSchema = z
  .string()
  .trim()
  .min(3, { error: "Change note: say in a few words what changed and why (3 to 500 characters)." })
  .max(500, { error: "Change note: at most 500 characters." });

/** Shared text fields of every item. */
export const nameSchema = z
  .string({ error: "Name: enter 2 to 120 characters." })
  .trim()
  .min(2, { error: "Name: enter 2 to 120 characters." })
  .max(120, { error: "Name: at most 120 characters." });
export const organisationSchema = z.string().trim().max(120, { error: "Organisation or project: at most 120 characters." });
export const notesSchema = z.string().trim().max(4000, { error: "Notes: at most 4000 characters." });

/** How an edit is saved: as a new version (always allowed) or as a correction of the current one (only while unused). */
export const SAVE_MODES = ["new-version", "in-place"] as const;
export type SaveMode = (typeof SAVE_MODES)[number];

/** Fields every item form has besides its content. */
export const versionMetaFormSchema = z.object({
  provenanceKind: z.enum(["measured", "assumed"], { error: "Provenance: choose measured or assumed (fitted values come from the fit page)." }).or(z.literal("fitted")),
  provenanceSource: z.string().trim().max(2000, { error: "Source: at most 2000 characters." }),
  changeNote: changeNoteSchema,
  mode: z.enum(SAVE_MODES).default("new-version"),
});
