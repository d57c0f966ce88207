"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type UseFormRegister } from "react-hook-form";
import { readNumber } from "@/lib/library/form-numbers";
import { saveLibraryItemAction } from "@/lib/library/actions";
import { fieldsFor, MODEL_LABELS, type ParamField } from "@/lib/library/populations/fields";
import { POPULATION_KIND_LABELS, POPULATION_KINDS, populationFormSchema, type PopulationForm as FormValues } from "@/lib/library/populations/content";
import { SHELL_MODELS, type ShellModel } from "@/lib/populations/spec";
import { LAB_UNITS } from "@/lib/units/lab";
import { applyServerErrors } from "./save-result";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";
import { useHydrated } from "@/components/forms/use-hydrated";

type ParamErrors = Record<string, { mean?: { message?: string }; cv?: { message?: string } } | undefined>;

function ParamRow({ f, register, errors }: { f: ParamField; register: UseFormRegister<FormValues>; errors: ParamErrors }) {
  const unit = LAB_UNITS[f.unit].symbol;
  const err = errors[f.key];
  const id = `param-${f.key}`;
  return (
    <div className="grid grid-cols-1 gap-2 border-b border-paper-line/60 py-2 sm:grid-cols-[15rem_minmax(10rem,16rem)_8.5rem_8.5rem]">
      <label htmlFor={id} className="text-sm font-medium text-ink-soft">
        {f.label}{f.optional ? " (optional)" : ""}
        {f.hint && <span className="block text-xs font-normal text-ink-muted">{f.hint}</span>}
      </label>
      <div>
        <div className="flex items-center gap-2">
          <input id={id} className="input" inputMode="decimal" aria-label={`${f.label} (${unit || "relative"})`} {...register(`params.${f.key}.mean`, { setValueAs: readNumber })} />
          <span className="w-16 text-sm text-ink-muted">{unit || "—"}</span>
        </div>
        {err?.mean && <p className="field-error">{err.mean.message}</p>}
      </div>
      {f.spread ? (
        <>
          <div>
            <div className="flex items-center gap-1">
              <input className="input" inputMode="decimal" aria-label={`${f.label} spread (CV %)`} {...register(`params.${f.key}.cv`, { setValueAs: readNumber })} />
              <span className="whitespace-nowrap text-sm text-ink-muted">% CV</span>
            </div>
            {err?.cv && <p className="field-error">{err.cv.message}</p>}
          </div>
          <select className="input" aria-label={`${f.label} distribution`} {...register(`params.${f.key}.distribution`)}>
            <option value="normal">normal</option>
            <option value="lognormal">log-normal</option>
          </select>
        </>
      ) : (
        <p className="self-center text-xs text-ink-muted sm:col-span-2">single value (no spread)</p>
      )}
    </div>
  );
}

/** Create or edit a population in lab units; the same schema checks the values here and on the server. */
export function PopulationForm({ defaults, editing }: { defaults: FormValues; editing: EditingInfo | null }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, watch, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({ resolver: zodResolver(populationFormSchema), defaultValues: defaults });
  const model = watch("model") as ShellModel;
  const fields = fieldsFor(model);
  const groups = [...new Set(fields.map((f) => f.group))];

  async function onSubmit(values: FormValues) {
    const result = await saveLibraryItemAction("populations", editing ? { id: editing.id, baseVersion: editing.version } : null, values);
    setStatus({ ok: result.ok, text: applyServerErrors(result, setError) });
    if (result.ok && result.data) {
      router.push(`/library/populations/${result.data.id}`);
      router.refresh();
    }
  }

  const paramErrors = (errors.params ?? {}) as ParamErrors;
  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-5">
      <fieldset className="card grid gap-4 sm:grid-cols-2">
        <legend className="px-1 text-base font-semibold">Population</legend>
        <label className="field">
          <span>Name</span>
          <input className="input" {...register("name")} />
          {errors.name && <p className="field-error">{errors.name.message}</p>}
        </label>
        <label className="field">
          <span>Kind</span>
          <select className="input" {...register("kind")}>
            {POPULATION_KINDS.map((k) => <option key={k} value={k}>{POPULATION_KIND_LABELS[k]}</option>)}
          </select>
          {errors.kind && <p className="field-error">{errors.kind.message}</p>}
        </label>
        <label className="field">
          <span>Organisation or project</span>
          <input className="input" {...register("organisation")} />
          {errors.organisation && <p className="field-error">{errors.organisation.message}</p>}
        </label>
        <label className="field">
          <span>Shell model</span>
          <select className="input" {...register("model")}>
            {SHELL_MODELS.map((m) => <option key={m} value={m}>{MODEL_LABELS[m]}</option>)}
          </select>
          {errors.model && <p className="field-error">{errors.model.message}</p>}
        </label>
        <label className="field sm:col-span-2">
          <span>Description</span>
          <textarea className="input" rows={2} {...register("description")} />
          {errors.description && <p className="field-error">{errors.description.message}</p>}
        </label>
      </fieldset>
      {groups.map((g) => (
        <fieldset key={g} className="card">
          <legend className="px-1 text-base font-semibold">{g}</legend>
          <p className="hint mb-1">Mean in the unit shown; spread as a coefficient of variation (10 % means the standard deviation is a tenth of the mean).</p>
          {fields.filter((f) => f.group === g).map((f) => <ParamRow key={f.key} f={f} register={register} errors={paramErrors} />)}
        </fieldset>
      ))}
      <VersionMetaFields register={register as never} errors={errors} editing={editing} />
      <div className="flex items-center gap-3">
        <button className="btn" type="submit" disabled={!hydrated || isSubmitting}>{editing ? "Save" : "Create population"}</button>
        {status && <p className={`text-sm ${status.ok ? "text-moss-dark" : "text-danger"}`} role="status">{status.text}</p>}
        {!status && Object.keys(errors).length > 0 && <p className="text-sm text-danger" role="status">Some fields need attention; see the messages next to them.</p>}
      </div>
    </form>
  );
}
