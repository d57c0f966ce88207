"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { PopulationEditor } from "@/components/populations/population-editor";
import { saveLibraryItemAction } from "@/lib/library/actions";
import { POPULATION_KIND_LABELS, POPULATION_KINDS, populationFormSchema, type PopulationForm as FormValues } from "@/lib/library/populations/content";
import type { ShellModel } from "@/lib/populations/fields";
import { applyServerErrors } from "./save-result";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";
import { useHydrated } from "@/components/forms/use-hydrated";

/** Create or edit a population in lab units; the same schema checks the values here and on the server. */
export function PopulationForm({ defaults, editing }: { defaults: FormValues; editing: EditingInfo | null }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, watch, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({ resolver: zodResolver(populationFormSchema), defaultValues: defaults });
  const model = watch("model") as ShellModel;

  async function onSubmit(values: FormValues) {
    const result = await saveLibraryItemAction("populations", editing ? { id: editing.id, baseVersion: editing.version } : null, values);
    setStatus({ ok: result.ok, text: applyServerErrors(result, setError) });
    if (result.ok && result.data) {
      router.push(`/library/populations/${result.data.id}`);
      router.refresh();
    }
  }

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
      <div className="flex items-center gap-3">
        <button className="btn" type="submit" disabled={!hydrated || isSubmitting}>{editing ? "Save" : "Create population"}</button>
        {status && <p className={`text-sm ${status.ok ? "text-moss-dark" : "text-danger"}`} role="status">{status.text}</p>}
        {!status && Object.keys(errors).length > 0 && <p className="text-sm text-danger" role="status">Some fields need attention; see the messages next to them.</p>}
      </div>
    </form>
  );
}
