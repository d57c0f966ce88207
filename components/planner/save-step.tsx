"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { saveProtocolAction } from "@/lib/wizard/drafts/actions";
import { saveStepSchema, type SaveStepValues } from "@/lib/wizard/save-form";
import { errorAt, NumField } from "@/components/forms/num-field";
import { SaveStatus } from "./save-status";
import { useAutosave } from "./use-autosave";
import { useHydrated } from "@/components/forms/use-hydrated";

/** Step 6: title and purpose, new protocol or new version, bench preparation; saves a protocol draft. */
export function SaveStep({ draftId, initial, protocols, summary }: { draftId: number; initial: SaveStepValues; protocols: { id: number; label: string }[]; summary: string | null }) {
  const hydrated = useHydrated();
  const [done, setDone] = useState<{ protocolId: number; message: string } | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<SaveStepValues>({ resolver: zodResolver(saveStepSchema), defaultValues: initial, mode: "onChange" });
  const values = useWatch({ control }) as SaveStepValues;
  const { state } = useAutosave(draftId, "save", values);

  async function onValid(v: SaveStepValues) {
    setFormError(null);
    const result = await saveProtocolAction(draftId, v);
    if (!result.ok) {
      for (const [field, message] of Object.entries(result.fieldErrors ?? {})) if (field in v) setError(field as keyof SaveStepValues, { message });
      setFormError(result.message);
      return;
    }
    setDone({ protocolId: result.data!.protocolId, message: result.message ?? "Saved." });
  }

  if (done) {
    return (
      <div className="card space-y-3" data-testid="saved">
        <h2>Saved</h2>
        <p>{done.message} It is a draft: open it to review the content, then submit it for review.</p>
        <p className="flex flex-wrap gap-3">
          <Link className="btn" href={`/protocols/${done.protocolId}`}>Open the protocol</Link>
          <Link className="btn-quiet" href="/protocols">See it in the protocol list</Link>
          <Link className="btn-quiet" href="/planner">Back to the planner</Link>
        </p>
      </div>
    );
  }

  return (
    <form onSubmit={handleSubmit(onValid, () => setFormError("Some fields need attention; each says what is allowed."))} noValidate className="space-y-6">
      {summary ? <p className="notice" data-testid="save-summary">{summary}</p> : <p className="notice">No window is selected yet. <Link href={`/planner/${draftId}/results`}>Choose one on the Results step</Link>.</p>}
      <div className="card grid gap-4 md:grid-cols-2">
        <div className="field md:col-span-2">
          <label htmlFor="save-title" className="mb-1 block font-medium text-ink-soft">Protocol title</label>
          <input id="save-title" className="input" {...register("title")} aria-invalid={errors.title ? true : undefined} />
          {errors.title && <p className="field-error">{errors.title.message}</p>}
        </div>
        <div className="field md:col-span-2">
          <label htmlFor="save-purpose" className="mb-1 block font-medium text-ink-soft">Purpose</label>
          <textarea id="save-purpose" className="input min-h-20" {...register("purpose")} aria-invalid={errors.purpose ? true : undefined} />
          <p className="hint">What the sort is for and which samples it applies to, in a sentence or two.</p>
          {errors.purpose && <p className="field-error">{errors.purpose.message}</p>}
        </div>
        <fieldset className="md:col-span-2">
          <legend className="mb-1 text-sm font-medium text-ink-soft">Save as</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2"><input type="radio" value="new" {...register("destination")} /> A new protocol (version 1)</label>
            <label className="flex items-center gap-2"><input type="radio" value="existing" {...register("destination")} disabled={protocols.length === 0} aria-describedby={protocols.length === 0 ? "save-existing-why" : undefined} /> A new version of an existing protocol</label>
          </div>
          {protocols.length === 0 && <p id="save-existing-why" className="hint" data-testid="existing-disabled-reason">Not available: no protocol can take a new version now. A new version starts from a protocol whose latest version is approved, superseded or retired; one with a draft, in-review or returned version must finish that version first. Save this plan as a new protocol instead.</p>}
        </fieldset>
        {values.destination === "existing" && (
          <div className="field md:col-span-2">
            <label htmlFor="save-protocol" className="mb-1 block font-medium text-ink-soft">Protocol</label>
            <select id="save-protocol" className="input" {...register("protocolId", { setValueAs: (x) => (x === "" || x === null ? null : Number(x)) })}>
              <option value="">— choose —</option>
              {protocols.map((p) => <option key={p.id} value={p.id}>{p.label}</option>)}
            </select>
            {errorAt(errors, "protocolId") && <p className="field-error">{errorAt(errors, "protocolId")}</p>}
          </div>
        )}
        <NumField id="save-washes" label="Washes in DEP buffer before loading (count)" registration={register("washes", { valueAsNumber: true })} error={errors.washes?.message} hint="0–10" step={1} />
        <NumField id="save-density" label="Resuspension density (million cells/mL)" registration={register("resuspensionMillionsPerMl", { valueAsNumber: true })} error={errors.resuspensionMillionsPerMl?.message} hint="above 0, at most 1000" />
        <div className="field md:col-span-2">
          <label htmlFor="save-notes" className="mb-1 block font-medium text-ink-soft">Preparation notes for the bench sheet</label>
          <textarea id="save-notes" className="input min-h-16" {...register("notes")} />
          {errors.notes && <p className="field-error">{errors.notes.message}</p>}
        </div>
      </div>
      <div className="flex flex-wrap items-center gap-4 border-t border-paper-line pt-4">
        <Link href={`/planner/${draftId}/results`} className="btn-quiet">← Back</Link>
        <button type="submit" className="btn" disabled={!hydrated || isSubmitting || !summary}>{isSubmitting ? "Saving…" : "Save as protocol draft"}</button>
        <SaveStatus state={state} />
        {formError && <p className="field-error w-full" data-testid="form-error">{formError}</p>}
      </div>
    </form>
  );
}
