"use client";

import { PopulationEditor } from "@/components/populations/population-editor";
import { POPULATION_KIND_LABELS, POPULATION_KINDS, populationFormSchema, type PopulationForm as FormValues } from "@/lib/library/populations/content";
import type { ShellModel } from "@/lib/populations/fields";
import { SubmitRow } from "./form-bits";
import { useItemForm } from "./use-item-form";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";

/** Create or edit a population in lab units; the same schema checks the values here and on the server. */
export function PopulationForm({ defaults, editing }: { defaults: FormValues; editing: EditingInfo | null }) {
  const { form, status, submit } = useItemForm<FormValues>("populations", populationFormSchema, defaults, editing);
  const { register, watch, formState: { errors, isSubmitting } } = form;
  const model = watch("model") as ShellModel;

  return (
    <form onSubmit={submit} noValidate className="space-y-5">
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
        <label className="field sm:col-span-2">
          <span>Description</span>
          <textarea className="input" rows={2} {...register("description")} />
          {errors.description && <p className="field-error">{errors.description.message}</p>}
        </label>
      </fieldset>
      <fieldset className="card">
        <legend className="px-1 text-base font-semibold">Dielectric model</legend>
        <PopulationEditor prefix="" idPrefix="population" model={model} register={register} errors={errors} />
      </fieldset>
      <VersionMetaFields register={register as never} errors={errors} editing={editing} />
      <SubmitRow label={editing ? "Save" : "Create population"} busy={isSubmitting} status={status} hasErrors={Object.keys(errors).length > 0} />
    </form>
  );
}
