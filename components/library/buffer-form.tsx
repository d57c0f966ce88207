"use client";

import { BenchFields, BufferNumber, MeterReadingFields, RecipeFields, RecipePrediction } from "@/components/buffers/buffer-editor";
import { predictRecipe } from "@/lib/buffers/recipe";
import { bufferFormSchema, type BufferForm as FormValues } from "@/lib/library/buffers/content";
import { formatIn, toSI } from "@/lib/units/lab";
import { SubmitRow } from "./form-bits";
import { useItemForm } from "./use-item-form";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";

/** Create or edit a buffer in lab units with the shared buffer editor, and the engine's prediction for the recipe as you type. */
export function BufferForm({ defaults, editing }: { defaults: FormValues; editing: EditingInfo | null }) {
  const { form, status, submit } = useItemForm<FormValues>("buffers", bufferFormSchema, defaults, editing);
  const { register, control, watch, formState: { errors, isSubmitting } } = form;
  const v = watch();
  const target = typeof v.targetConductivity === "number" && Number.isFinite(v.targetConductivity) ? toSI("mS_m", v.targetConductivity) : null;
  const prediction = v.useRecipe
    ? predictRecipe({
        sucrosePercentWV: Number(v.sucrosePercentWV) || 0,
        glucosePercentWV: Number(v.glucosePercentWV) || 0,
        additions: (v.additions ?? []).filter((a) => Number.isFinite(a.perLitre)).map((a) => ({ kind: a.kind, perLitre: Number(a.perLitre) })),
      })
    : null;


  return (
    <form onSubmit={submit} noValidate className="space-y-5">
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
        <BufferNumber name="targetConductivity" register={register} errors={errors} hint={target !== null ? `= ${formatIn("uS_cm", target)}` : "1 mS/m = 10 µS/cm"} />
      </fieldset>

      <fieldset className="card space-y-4">
        <legend className="px-1 text-base font-semibold">Recipe</legend>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" {...register("useRecipe")} /> Record the recipe (otherwise only the conductivity is kept)
        </label>
        {v.useRecipe && (
          <div className="grid gap-4 lg:grid-cols-[1fr_18rem]">
            <RecipeFields register={register} errors={errors} control={control} values={v} />
            <aside className="rounded-md border border-paper-line bg-paper p-3 text-sm" aria-live="polite" data-testid="recipe-prediction">
              <p className="font-medium">Predicted for this recipe (1 L of base at 25 °C)</p>
              {prediction && <RecipePrediction result={prediction.result} error={prediction.error} target={target} />}
              <p className="hint">A model prediction: measure with a calibrated meter.</p>
            </aside>
          </div>
        )}
      </fieldset>

      <fieldset className="card space-y-4">
        <legend className="px-1 text-base font-semibold">Measured</legend>
        <MeterReadingFields register={register} errors={errors} optional />
        <BenchFields register={register} errors={errors} />
        <label className="field">
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
