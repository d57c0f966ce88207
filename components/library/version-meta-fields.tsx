"use client";

import type { FieldErrors, UseFormRegister } from "react-hook-form";

/** What the form knows about the version being edited (null when creating). */
export interface EditingInfo {
  id: number;
  version: number;
  /** A protocol version in review or signed refers to it: no correction in place. */
  inUse: boolean;
  baseFitted: boolean;
}

interface MetaValues {
  provenanceKind: string;
  provenanceSource: string;
  changeNote: string;
  mode?: string;
}

/** Provenance, change note and how to save (new version or correction in place). */
export function VersionMetaFields({ register, errors, editing }: { register: UseFormRegister<MetaValues>; errors: FieldErrors<MetaValues>; editing: EditingInfo | null }) {
  return (
    <fieldset className="card space-y-4">
      <legend className="px-1 text-base font-semibold">Provenance and saving</legend>
      <div className="grid gap-4 sm:grid-cols-[19rem_1fr]">
        <label className="field">
          <span>Where the values come from</span>
          <select className="input" {...register("provenanceKind")}>
            <option value="measured">Measured</option>
            <option value="assumed">Assumed (literature or estimate)</option>
            {editing?.baseFitted && <option value="fitted">Fitted (keep the current fit)</option>}
          </select>
          {errors.provenanceKind && <p className="field-error">{errors.provenanceKind.message}</p>}
        </label>
        <label className="field">
          <span>Source</span>
          <input className="input" {...register("provenanceSource")} placeholder="e.g. meter reading 2026-11-28, or a reference you trust" />
          {errors.provenanceSource && <p className="field-error">{errors.provenanceSource.message}</p>}
        </label>
      </div>
      <label className="field">
        <span>Change note</span>
        <input className="input" {...register("changeNote")} placeholder={editing ? "What changed and why" : "e.g. first entry from the October measurements"} />
        <p className="hint">Kept with the version in the history and the audit trail.</p>
        {errors.changeNote && <p className="field-error">{errors.changeNote.message}</p>}
      </label>
      {editing && (
        <div className="space-y-1 text-sm">
          <label className="flex items-start gap-2">
            <input type="radio" value="new-version" {...register("mode")} className="mt-1" />
            <span>Save as a new version (v{editing.version + 1}); v{editing.version} stays in the history as it is.</span>
          </label>
          <label className={`flex items-start gap-2 ${editing.inUse ? "text-ink-muted" : ""}`}>
            <input type="radio" value="in-place" {...register("mode")} disabled={editing.inUse} className="mt-1" />
            <span>
              Correct v{editing.version} in place (for typos and slips).
              {editing.inUse ? " Not possible: a protocol version in review or signed uses v" + editing.version + "." : " Only while no protocol in review or signed uses it; the correction is recorded in the audit trail."}
            </span>
          </label>
          {errors.mode && <p className="field-error">{errors.mode.message}</p>}
        </div>
      )}
    </fieldset>
  );
}
