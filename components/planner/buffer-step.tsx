"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { BenchFields, BufferNumber, MeterReadingFields, RecipeFields, RecipePrediction } from "@/components/buffers/buffer-editor";
import { formatConductivity } from "@/lib/units/format";
import { bufferChoice, bufferStepSchema, libraryBufferToStep, predictRecipe, type BufferStepValues, type LibraryBufferContent } from "@/lib/wizard/buffer-form";
import { errorAt } from "@/components/forms/num-field";
import { StepFooter } from "./step-footer";
import { useAutosave } from "./use-autosave";

const MODES = [
  { value: "recipe", label: "Make it up from a recipe", hint: "Sugar base plus salt or stock; the calculator predicts conductivity and osmolality." },
  { value: "measured", label: "Use a measured conductivity", hint: "A meter reading of the buffer you have, with its temperature." },
  { value: "range", label: "Search a conductivity range", hint: "Let the planner find the best conductivity; make the buffer afterwards." },
] as const;

/** Step 2: the suspending buffer — recipe with computed properties, a measured conductivity, or a range to search (the shared buffer editor). */
export function BufferStep({ draftId, initial, library }: { draftId: number; initial: BufferStepValues; library: { id: number; version: number; name: string; content: LibraryBufferContent }[] }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, reset, formState: { errors, isSubmitting } } = useForm<BufferStepValues>({ resolver: zodResolver(bufferStepSchema) as never, defaultValues: initial, mode: "onChange" });
  const values = useWatch({ control }) as BufferStepValues;
  const { state, saveNow } = useAutosave(draftId, "buffer", values);
  const prediction = values.mode === "recipe" ? predictRecipe(values) : null;
  const valid = bufferStepSchema.safeParse(values).success;
  const choice = valid ? bufferChoice(values) : null;

  async function onValid() {
    setFormError(null);
    if (await saveNow("device")) router.push(`/planner/${draftId}/device`);
  }

  return (
    <form onSubmit={handleSubmit(onValid, () => setFormError("Some fields need attention; each says what is allowed."))} noValidate className="space-y-6">
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <div className="card space-y-4">
          <div className="grid gap-4 sm:grid-cols-2">
            <div className="field">
              <label htmlFor="buffer-pick" className="mb-1 block font-medium text-ink-soft">Start from a library buffer</label>
              <select id="buffer-pick" className="input" defaultValue="" onChange={(e) => {
                const item = library.find((l) => String(l.id) === e.target.value);
                if (item) reset(libraryBufferToStep(item.content, { id: item.id, version: item.version }));
              }}>
                <option value="">— keep what is below —</option>
                {library.map((l) => <option key={l.id} value={l.id}>{l.name} (v{l.version})</option>)}
              </select>
              <p className="hint">{library.length === 0 ? "The buffer library is empty; define the buffer here." : "Copies the buffer; editing here does not change the library."}</p>
            </div>
            <div className="field">
              <label htmlFor="buffer-name" className="mb-1 block font-medium text-ink-soft">Buffer name</label>
              <input id="buffer-name" className="input" {...register("name")} />
              {errorAt(errors, "name") && <p className="field-error">{errorAt(errors, "name")}</p>}
            </div>
          </div>
          <fieldset>
            <legend className="mb-1 text-sm font-medium text-ink-soft">How is the conductivity given?</legend>
            <div className="grid gap-2 sm:grid-cols-3">
              {MODES.map((m) => (
                <label key={m.value} className={`flex cursor-pointer gap-2 rounded-md border p-2 text-sm ${values.mode === m.value ? "border-moss bg-moss-light/50" : "border-paper-line"}`}>
                  <input type="radio" value={m.value} {...register("mode")} className="mt-1" />
                  <span><span className="font-medium">{m.label}</span><span className="block text-xs text-ink-muted">{m.hint}</span></span>
                </label>
              ))}
            </div>
          </fieldset>

          {values.mode === "recipe" && (
            <RecipeFields register={register} errors={errors} control={control} values={values} batch={<>
              <BufferNumber name="volumeMl" register={register} errors={errors} />
              <BufferNumber name="temperatureC" register={register} errors={errors} hint="The prediction is also given at this temperature, for checking with a meter" />
            </>} />
          )}
          {values.mode === "measured" && <MeterReadingFields register={register} errors={errors} />}
          {values.mode === "range" && (
            <fieldset className="grid gap-3 rounded-md border border-paper-line p-3 sm:grid-cols-2">
              <legend className="px-1 text-sm font-semibold">Range to search (log-spaced, 31 steps)</legend>
              <BufferNumber name="rangeLow" register={register} errors={errors} />
              <BufferNumber name="rangeHigh" register={register} errors={errors} />
            </fieldset>
          )}
          <BenchFields register={register} errors={errors} />
        </div>

        <aside className="card space-y-3" aria-labelledby="buffer-summary" data-testid="buffer-summary">
          <h2 id="buffer-summary">What the planner will use</h2>
          {values.mode === "recipe" && prediction && <RecipePrediction result={prediction.result} error={prediction.error} temperatureC={values.temperatureC} finalVolume />}
          {values.mode !== "recipe" && choice && (
            <p className="text-sm">{choice.conductivity25 !== null ? `Medium conductivity ${formatConductivity(choice.conductivity25, { meter: true })} at 25 °C.` : `Search from ${formatConductivity(choice.range25!.low)} to ${formatConductivity(choice.range25!.high)} at 25 °C.`}</p>
          )}
          <p className="text-xs text-ink-muted">Conductivity is converted to the operating temperature of the next step with 2 %/K. Predicted values are estimates: measure the buffer with a calibrated meter and an osmometer before use.</p>
          {values.mode === "recipe" && prediction?.result && (
            <details className="text-xs text-ink-soft"><summary className="cursor-pointer">Calculator assumptions</summary><ul className="mt-1 list-disc pl-4">{prediction.result.assumptions.map((a) => <li key={a}>{a}</li>)}</ul></details>
          )}
        </aside>
      </div>
      <StepFooter backHref={`/planner/${draftId}/populations`} nextLabel="Next: device and drive" state={state} busy={isSubmitting} formError={formError} />
    </form>
  );
}
