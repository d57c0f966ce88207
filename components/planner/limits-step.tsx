"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { defaultConstraints } from "@/lib/planner/constraints";
import { ACEO_LEVELS, defaultLimits, defaultText, LIMIT_FIELDS, limitsStepSchema, SORT_DESIGNS, type LimitsStepValues, type SortDesignKey } from "@/lib/wizard/limits-form";
import { errorAt } from "@/components/forms/num-field";
import { StepFooter } from "./step-footer";
import { useAutosave } from "./use-autosave";

/** Step 4: every limit with its default and the planner library's one-line reason. */
export function LimitsStep({ draftId, initial }: { draftId: number; initial: LimitsStepValues }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, setValue, formState: { errors, isSubmitting } } = useForm<LimitsStepValues>({ resolver: zodResolver(limitsStepSchema) as never, defaultValues: initial, mode: "onChange" });
  const values = useWatch({ control }) as LimitsStepValues;
  const { state, saveNow } = useAutosave(draftId, "limits", values);
  const defaults = defaultLimits();

  async function onValid() {
    setFormError(null);
    if (await saveNow("results")) router.push(`/planner/${draftId}/results`);
  }

  return (
    <form onSubmit={handleSubmit(onValid, () => setFormError("Some fields need attention; each says what is allowed."))} noValidate className="space-y-6">
      <div className="card">
        <table>
          <caption className="sr-only">Limits, their defaults and why</caption>
          <thead><tr><th scope="col">Limit</th><th scope="col" className="w-40">Value</th><th scope="col">Default and why</th></tr></thead>
          <tbody>
            {LIMIT_FIELDS.map((f) => {
              const id = `limit-${f.key}`;
              const error = errorAt(errors, f.key);
              const changed = values[f.key] !== defaults[f.key];
              return (
                <tr key={f.key}>
                  <td><label htmlFor={id} className="font-medium">{f.label} ({f.unit})</label></td>
                  <td>
                    <input id={id} className="input" type="number" step={f.step} {...register(f.key, { valueAsNumber: true })} aria-invalid={error ? true : undefined} aria-describedby={`${id}-why${error ? ` ${id}-error` : ""}`} />
                    {error && <p id={`${id}-error`} className="field-error">{error}</p>}
                  </td>
                  <td id={`${id}-why`} className="text-ink-soft">
                    <span className="font-medium text-ink">Default {defaultText(f.key)}.</span> {f.reason}
                    {changed && <button type="button" className="ml-2 text-xs text-moss-dark underline" onClick={() => setValue(f.key, defaults[f.key], { shouldValidate: true })}>Use the default</button>}
                  </td>
                </tr>
              );
            })}
            <tr>
              <td><label htmlFor="limit-aceo" className="font-medium">Worst AC electro-osmosis regime accepted</label></td>
              <td><select id="limit-aceo" className="input" {...register("maxAcElectroosmosis")} aria-describedby="limit-aceo-why">{ACEO_LEVELS.map((l) => <option key={l} value={l}>{l}</option>)}</select></td>
              <td id="limit-aceo-why" className="text-ink-soft"><span className="font-medium text-ink">Default {defaultConstraints.maxAcElectroosmosis.value}.</span> {defaultConstraints.maxAcElectroosmosis.reason}</td>
            </tr>
          </tbody>
        </table>
      </div>
      <fieldset className="card">
        <legend className="px-1 text-lg font-semibold">Sort design</legend>
        <div className="grid gap-2 md:grid-cols-2">
          {(Object.keys(SORT_DESIGNS) as SortDesignKey[]).map((k) => (
            <label key={k} className={`flex cursor-pointer gap-2 rounded-md border p-2 text-sm ${values.sortDesign === k ? "border-moss bg-moss-light/50" : "border-paper-line"}`}>
              <input type="radio" value={k} {...register("sortDesign")} className="mt-1" />
              <span><span className="font-medium">{SORT_DESIGNS[k].label}</span><span className="block text-xs text-ink-muted">{SORT_DESIGNS[k].reason}{k === defaults.sortDesign ? " (default)" : ""}</span></span>
            </label>
          ))}
        </div>
      </fieldset>
      <StepFooter backHref={`/planner/${draftId}/device`} nextLabel="Compute windows" state={state} busy={isSubmitting} formError={formError} />
    </form>
  );
}
