"use client";

import type { FieldErrors, UseFormRegister, UseFormSetValue } from "react-hook-form";
import { errorAt } from "@/components/forms/num-field";
import { PopulationEditor } from "@/components/populations/population-editor";
import type { PopulationSpec } from "@/lib/populations/spec";
import type { PopulationFormValues, PopulationsStepValues } from "@/lib/wizard/population-form";
import { specToForm } from "@/lib/wizard/population-form";
import type { StartingPoint } from "@/lib/wizard/starting-points";
import { SaveToLibrary } from "./save-to-library";

/** A population the library offers (current version, SI spec). */
export interface LibraryPopulation {
  id: number;
  version: number;
  name: string;
  category: string | null;
  spec: PopulationSpec;
}

/**
 * One population of the planner's step (target or other): pick from the library or a starting point, name it, and
 * edit its shell model with the shared population editor.
 */
export function PopulationCard({ which, heading, values, register, setValue, errors, library, starts, canSaveToLibrary }: {
  which: "target" | "other";
  heading: string;
  values: PopulationFormValues;
  register: UseFormRegister<PopulationsStepValues>;
  setValue: UseFormSetValue<PopulationsStepValues>;
  errors: FieldErrors<PopulationsStepValues>;
  library: LibraryPopulation[];
  starts: StartingPoint[];
  /** The viewer may write the library (capability library.edit). */
  canSaveToLibrary: boolean;
}) {
  const id = (path: string) => `${which}-${path.replace(/\./g, "-")}`;
  const err = (path: string) => errorAt(errors, `${which}.${path}`);

  function pick(value: string) {
    if (!value) return;
    const [kind, key] = value.split(":");
    if (kind === "lib") {
      const item = library.find((l) => String(l.id) === key);
      if (item) setValue(which, specToForm(item.name, item.spec, { id: item.id, version: item.version }), { shouldValidate: true, shouldDirty: true });
    } else {
      const start = starts.find((s) => s.key === key);
      if (start) setValue(which, structuredClone(start.values), { shouldValidate: true, shouldDirty: true });
    }
  }

  return (
    <fieldset className="card space-y-4" data-testid={`population-${which}`}>
      <legend className="px-1 text-lg font-semibold">{heading}</legend>
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="field">
          <label htmlFor={id("pick")} className="mb-1 block font-medium text-ink-soft">Start from</label>
          <select id={id("pick")} className="input" defaultValue="" onChange={(e) => pick(e.target.value)}>
            <option value="">— keep what is below —</option>
            {library.length > 0 && (
              <optgroup label="Population library">
                {library.map((l) => <option key={l.id} value={`lib:${l.id}`}>{l.name} (v{l.version}{l.category ? `, ${l.category}` : ""})</option>)}
              </optgroup>
            )}
            <optgroup label="Starting points (typical values)">
              {starts.map((s) => <option key={s.key} value={`start:${s.key}`}>{s.label}</option>)}
            </optgroup>
          </select>
          <p className="hint">{values.libraryRef ? `From the library (item ${values.libraryRef.id}, version ${values.libraryRef.version}); editing here does not change the library.` : "Defined here; save it to the library (below) if you want to reuse it."}</p>
        </div>
        <div className="field">
          <label htmlFor={id("name")} className="mb-1 block font-medium text-ink-soft">Name</label>
          <input id={id("name")} className="input" {...register(`${which}.name`)} aria-invalid={err("name") ? true : undefined} />
          {err("name") && <p className="field-error">{err("name")}</p>}
        </div>
      </div>

      <PopulationEditor prefix={which} idPrefix={which} model={values.model} register={register} errors={errors} />
      <SaveToLibrary which={which} values={values} allowed={canSaveToLibrary} onSaved={(ref) => setValue(`${which}.libraryRef`, ref, { shouldDirty: true })} />
    </fieldset>
  );
}
