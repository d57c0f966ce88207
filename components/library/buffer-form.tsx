"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import { saveLibraryItemAction } from "@/lib/library/actions";
import { ADDITION_KINDS, additionLabel, bufferFormSchema, isSalt, predictRecipe, type BufferForm as FormValues } from "@/lib/library/buffers/content";
import { readNumber } from "@/lib/units/lab-fields";
import { formatIn, toSI } from "@/lib/units/lab";
import { NumberField, SubmitRow } from "./form-bits";
import { applyServerErrors } from "./save-result";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";
import { formatPercentFixed } from "@/lib/units/format";
import { decimals } from "@/lib/units/number";

const num = { setValueAs: readNumber };

/** Create or edit a buffer in lab units, with the engine's prediction for the recipe as you type. */
export function BufferForm({ defaults, editing }: { defaults: FormValues; editing: EditingInfo | null }) {
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, control, handleSubmit, watch, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({ resolver: zodResolver(bufferFormSchema), defaultValues: defaults });
  const additions = useFieldArray({ control, name: "additions" });
  const v = watch();
  const target = typeof v.targetConductivity === "number" && Number.isFinite(v.targetConductivity) ? toSI("mS_m", v.targetConductivity) : null;
  const prediction = v.useRecipe
    ? predictRecipe({
        sucrosePercentWV: Number(v.sucrosePercentWV) || 0,
        glucosePercentWV: Number(v.glucosePercentWV) || 0,
        additions: (v.additions ?? []).filter((a) => Number.isFinite(a.amountPerLitre)).map((a) => ({ kind: a.kind, amountPerLitre: Number(a.amountPerLitre) })),
      })
    : null;

  async function onSubmit(values: FormValues) {
    const result = await saveLibraryItemAction("buffers", editing ? { id: editing.id, baseVersion: editing.version } : null, values);
    setStatus({ ok: result.ok, text: applyServerErrors(result, setError) });
    if (result.ok && result.data) {
      router.push(`/library/buffers/${result.data.id}`);
      router.refresh();
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-5">
      <fieldset className="card grid gap-4 sm:grid-cols-2">
        <legend className="px-1 text-base font-semibold">Buffer</legend>
        <label className="field">
          <span>Name</span>
          <input className="input" {...register("name")} />
          {errors.name && <p className="field-error">{errors.name.message}</p>}
        </label>
        <label className="field">
          <span>Organisation or project</span>
          <input className="input" {...register("organisation")} />
          {errors.organisation && <p className="field-error">{errors.organisation.message}</p>}
        </label>
        <NumberField label="Target conductivity at 25 °C" unit="mS/m" error={errors.targetConductivity?.message} hint={target !== null ? `= ${formatIn("uS_cm", target)}` : "1 mS/m = 10 µS/cm"}>
          <input className="input" inputMode="decimal" {...register("targetConductivity", num)} />
        </NumberField>
        <NumberField label="Accepted deviation" unit="± %" error={errors.tolerancePercent?.message}>
          <input className="input" inputMode="decimal" {...register("tolerancePercent", num)} />
        </NumberField>
      </fieldset>

      <fieldset className="card space-y-4">
        <legend className="px-1 text-base font-semibold">Recipe</legend>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register("useRecipe")} /> Record the recipe (otherwise only the conductivity is kept)
        </label>
        {v.useRecipe && (
          <div className="grid gap-4 lg:grid-cols-[1fr_18rem]">
            <div className="space-y-3">
              <div className="grid gap-4 sm:grid-cols-2">
                <NumberField label="Sucrose" unit="% w/v" error={errors.sucrosePercentWV?.message}>
                  <input className="input" inputMode="decimal" {...register("sucrosePercentWV", num)} />
                </NumberField>
                <NumberField label="Glucose" unit="% w/v" error={errors.glucosePercentWV?.message}>
                  <input className="input" inputMode="decimal" {...register("glucosePercentWV", num)} />
                </NumberField>
              </div>
              <p className="text-sm font-medium text-ink-soft">Additions per litre of sugar base</p>
              {additions.fields.map((a, k) => (
                <div key={a.id} className="flex flex-wrap items-start gap-2">
                  <select className="input w-auto" aria-label={`Addition ${k + 1}`} {...register(`additions.${k}.kind`)}>
                    {ADDITION_KINDS.map((kind) => <option key={kind} value={kind}>{additionLabel(kind)}</option>)}
                  </select>
                  <div>
                    <div className="flex items-center gap-1">
                      <input className="input w-28" inputMode="decimal" aria-label={`Amount of addition ${k + 1}`} {...register(`additions.${k}.amountPerLitre`, num)} />
                      <span className="text-sm text-ink-muted">{isSalt(v.additions?.[k]?.kind ?? "PBS1x") ? "g/L" : "mL/L"}</span>
                    </div>
                    {errors.additions?.[k]?.amountPerLitre && <p className="field-error">{errors.additions[k]?.amountPerLitre?.message}</p>}
                  </div>
                  <button type="button" className="btn-quiet" onClick={() => additions.remove(k)}>Remove</button>
                </div>
              ))}
              <button type="button" className="btn-quiet" onClick={() => additions.append({ kind: "PBS1x", amountPerLitre: 5 })}>Add a salt or stock</button>
            </div>
            <aside className="rounded-md border border-paper-line bg-paper p-3 text-sm" aria-live="polite" data-testid="recipe-prediction">
              <p className="font-medium">Predicted for this recipe (25 °C)</p>
              {prediction && "result" in prediction ? (
                <ul className="mt-1 space-y-0.5">
                  <li>Conductivity {formatIn("mS_m", prediction.result.conductivity25, 3)} ({formatIn("uS_cm", prediction.result.conductivity25, 3)})</li>
                  <li>Osmolality {formatIn("mOsm_kg", prediction.result.osmolality, 3)}</li>
                  <li>Viscosity {decimals(prediction.result.relativeViscosity, 2)} × water</li>
                  {target !== null && <li className={Math.abs(prediction.result.conductivity25 / target - 1) > 0.1 ? "text-caution" : "text-moss-dark"}>{formatPercentFixed(prediction.result.conductivity25 / target - 1, 0)} from the target</li>}
                  {prediction.result.warnings.map((w) => <li key={w.code} className="text-caution">{w.message}</li>)}
                </ul>
              ) : (
                <p className="mt-1 text-ink-muted">{prediction && "error" in prediction ? prediction.error : "Enter the sugars to see a prediction."}</p>
              )}
              <p className="hint">A model prediction: measure with a calibrated meter.</p>
            </aside>
          </div>
        )}
      </fieldset>

      <fieldset className="card grid gap-4 sm:grid-cols-3">
        <legend className="px-1 text-base font-semibold">Measured</legend>
        <NumberField label="Measured conductivity" unit="mS/m" error={errors.measuredConductivity?.message} hint="Leave empty if not measured yet.">
          <input className="input" inputMode="decimal" {...register("measuredConductivity", num)} />
        </NumberField>
        <NumberField label="…at temperature" unit="°C" error={errors.measuredTemperatureC?.message}>
          <input className="input" inputMode="decimal" {...register("measuredTemperatureC", num)} />
        </NumberField>
        <NumberField label="Measured osmolality" unit="mOsm/kg" error={errors.osmolality?.message}>
          <input className="input" inputMode="decimal" {...register("osmolality", num)} />
        </NumberField>
        <NumberField label="Longest time cells may stay in it" unit="min" error={errors.maxMinutesInBuffer?.message}>
          <input className="input" inputMode="numeric" {...register("maxMinutesInBuffer", num)} />
        </NumberField>
        <label className="field sm:col-span-2">
          <span>Notes</span>
          <textarea className="input" rows={2} {...register("notes")} />
          {errors.notes && <p className="field-error">{errors.notes.message}</p>}
        </label>
      </fieldset>
      <VersionMetaFields register={register as never} errors={errors} editing={editing} />
      <SubmitRow label={editing ? "Save" : "Create buffer"} busy={isSubmitting} status={status} hasErrors={Object.keys(errors).length > 0} />
    </form>
  );
}
