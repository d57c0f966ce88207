import type { StepSlug } from "../steps";
import { isStepSlug } from "../steps";

/** Every step's inputs as the user typed them (lab units), keyed by step; a step not yet visited is absent. */
export type WizardInputs = Partial<Record<StepSlug, unknown>>;

/** A wizard draft as the app sees it. */
export interface WizardDraft {
  id: number;
  ownerId: number;
  title: string;
  currentStep: StepSlug;
  inputs: WizardInputs;
  savedProtocolId: number | null;
  savedVersionId: number | null;
  lockVersion: number;
  createdAt: Date;
  updatedAt: Date;
}

/** A wizard_drafts row as MariaDB returns it (JSON columns come back as strings). */
export interface WizardDraftRow {
  id: number;
  owner_id: number;
  title: string;
  current_step: string;
  inputs_json: string | Record<string, unknown>;
  saved_protocol_id: number | null;
  saved_version_id: number | null;
  lock_version: number;
  created_at: Date | string;
  updated_at: Date | string;
}

/**
 * Maps a database row to a draft; an unknown step name falls back to the first step, bad JSON to no inputs.
 * @example toDraft(row).inputs.populations
 */
export function toDraft(row: WizardDraftRow): WizardDraft {
  let inputs: WizardInputs = {};
  try {
    const parsed = typeof row.inputs_json === "string" ? JSON.parse(row.inputs_json) : row.inputs_json;
    if (parsed && typeof parsed === "object" && !Array.isArray(parsed)) inputs = parsed as WizardInputs;
  } catch {
    inputs = {};
  }
  return {
    id: Number(row.id),
    ownerId: Number(row.owner_id),
    title: row.title,
    currentStep: isStepSlug(row.current_step) ? row.current_step : "populations",
    inputs,
    savedProtocolId: row.saved_protocol_id === null ? null : Number(row.saved_protocol_id),
    savedVersionId: row.saved_version_id === null ? null : Number(row.saved_version_id),
    lockVersion: Number(row.lock_version),
    createdAt: new Date(row.created_at),
    updatedAt: new Date(row.updated_at),
  };
}
