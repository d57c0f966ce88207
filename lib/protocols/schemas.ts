import { z } from "zod";
import { protocolContentSchema } from "./content";

/** The fixed list of meanings a reviewer picks when signing (the signature records the exact words). */
export const SIGNATURE_MEANINGS = [
  "Approved for bench use",
  "Reviewed — content verified",
  "Approved for a limited pilot run",
] as const;
export type SignatureMeaning = (typeof SIGNATURE_MEANINGS)[number];

const id = (label: string) => z.coerce.number({ error: `${label}: missing.` }).int().positive({ error: `${label}: missing.` });
const lockVersion = z.coerce
  .number({ error: "Lock version: missing; reload the page." })
  .int()
  .positive({ error: "Lock version: missing; reload the page." });

/** A new protocol: its title, purpose, an optional code prefix and the content of version 1. */
export const createProtocolSchema = z.object({
  title: z.string().trim().min(3, { error: "Title: 3 to 200 characters." }).max(200, { error: "Title: 3 to 200 characters." }),
  purpose: z.string().trim().min(3, { error: "Purpose: say in a sentence what the sort is for (3 to 2000 characters)." }).max(2000),
  codePrefix: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{2,5}$/, { error: "Code prefix: 2 to 5 letters, such as LFQ." })
    .optional(),
  content: protocolContentSchema,
});
export type CreateProtocolInput = z.input<typeof createProtocolSchema>;

/** Replacing a draft's content; `lockVersion` is the one the editor loaded. */
export const updateDraftSchema = z.object({
  versionId: id("Version"),
  lockVersion,
  content: protocolContentSchema,
});
export type UpdateDraftInput = z.input<typeof updateDraftSchema>;

/** The draft form on the version page: bench handling details, in lab units. */
export const draftDetailsSchema = z.object({
  versionId: id("Version"),
  lockVersion,
  washes: z.coerce.number({ error: "Washes: enter a whole number from 0 to 10." }).int({ error: "Washes: a whole number from 0 to 10." }).min(0, { error: "Washes: from 0 to 10." }).max(10, { error: "Washes: from 0 to 10." }),
  resuspensionMillionsPerMl: z.coerce
    .number({ error: "Resuspension density: enter a number of million cells per mL." })
    .positive({ error: "Resuspension density: must be above 0 million cells/mL." })
    .max(1000, { error: "Resuspension density: at most 1000 million cells/mL." }),
  tolerancePercent: z.coerce
    .number({ error: "Conductivity tolerance: enter a percentage from 1 to 50." })
    .min(1, { error: "Conductivity tolerance: from 1 % to 50 %." })
    .max(50, { error: "Conductivity tolerance: from 1 % to 50 %." }),
  maxMinutesInBuffer: z.coerce
    .number({ error: "Time in buffer: enter whole minutes from 1 to 240." })
    .int({ error: "Time in buffer: whole minutes from 1 to 240." })
    .min(1, { error: "Time in buffer: from 1 to 240 minutes." })
    .max(240, { error: "Time in buffer: from 1 to 240 minutes." }),
  notes: z.string().max(2000, { error: "Preparation notes: at most 2000 characters." }),
});
export type DraftDetailsInput = z.input<typeof draftDetailsSchema>;

/** Submitting a draft for review. */
export const submitSchema = z.object({ versionId: id("Version"), lockVersion });

/** Returning a version to its author, with the reason. */
export const returnSchema = z.object({
  versionId: id("Version"),
  lockVersion,
  comment: z.string().trim().min(5, { error: "Comment: tell the author what to change (at least 5 characters)." }).max(4000, { error: "Comment: at most 4000 characters." }),
});
export type ReturnInput = z.input<typeof returnSchema>;

/** The electronic signature: the reviewer's password again and the meaning of the signature. */
export const approveSchema = z.object({
  versionId: id("Version"),
  lockVersion,
  meaning: z.enum(SIGNATURE_MEANINGS, { error: `Meaning: pick one of: ${SIGNATURE_MEANINGS.join("; ")}.` }),
  password: z.string().min(1, { error: "Password: re-enter your password to sign." }).max(200),
});
export type ApproveInput = z.input<typeof approveSchema>;

/** Retiring an approved version, with the reason. */
export const retireSchema = z.object({
  versionId: id("Version"),
  lockVersion,
  reason: z.string().trim().min(5, { error: "Reason: say why the version is withdrawn (at least 5 characters)." }).max(2000),
});
export type RetireInput = z.input<typeof retireSchema>;

/** Starting a new version of a protocol. */
export const newVersionSchema = z.object({ protocolId: id("Protocol") });
