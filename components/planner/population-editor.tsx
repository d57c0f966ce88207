"use client";

import type { FieldErrors, UseFormRegister, UseFormSetValue } from "react-hook-form";
import { SHELL_MODELS, type PopulationSpec, type ShellModel } from "@/lib/populations/spec";
import { labelWithUnit, rangeInWords } from "@/lib/planner-wizard/lab-number";
import { MODEL_DESCRIPTIONS, MODEL_LAYOUT, PLAIN_FIELDS, POPULATION_FIELDS } from "@/lib/planner-wizard/population-fields";
import type { PopulationFormValues, PopulationsStepValues } from "@/lib/planner-wizard/population-form";
import { specToForm } from "@/lib/planner-wizard/population-form";
import type { StartingPoint } from "@/lib/planner-wizard/starting-points";
import { errorAt, NumField } from "./num-field";

/** A population the library offers (current version, SI spec). */
export interface LibraryPopulation {
  id: number;
  version: number;
  name: string;
  category: string | null;
  spec: PopulationSpec;
}

const MODEL_LABELS: Record<ShellModel, string> = { homogeneous: "Homogeneous", "single-shell": "Single shell", walled: "Walled (wall + membrane)", nucleated: "Nucleated" };

/**
 * The shell-model editor of one population (target or other): pick from the library or a starting point, or edit
 * the model and each parameter in lab units with its spread.
 */
export function PopulationEditor({ which, heading, values, register, setValue, errors, library, starts }: {
  which: "target" | "other";
  heading: string;
  values: PopulationFormValues;
  register: UseFormRegister<PopulationsStepValues>;
  setValue: UseFormSetValue<PopulationsStepValues>;
  errors: FieldErrors<PopulationsStepValues>;
  library: LibraryPopulation[];
  starts: StartingPoint[];
}) {
  const id = (path: string) => `${which}-${path.replace(/\./g, "-")}`;
  const reg = (path: string, asNumber = true) => register(`${which}.${path}` as never, asNumber ? { valueAsNumber: true } : undefined);
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
          <p className="hint">{values.libraryRef ? `From the library (item ${values.libraryRef.id}, version ${values.libraryRef.version}); editing here does not change the library.` : "Defined here; save it to the library later if you want to reuse it."}</p>
        </div>
        <div className="field">
          <label htmlFor={id("name")} className="mb-1 block font-medium text-ink-soft">Name</label>
          <input id={id("name")} className="input" {...register(`${which}.name`)} aria-invalid={err("name") ? true : undefined} />
          {err("name") && <p className="field-error">{err("name")}</p>}
        </div>
      </div>

      <fieldset>
        <legend className="mb-1 text-sm font-medium text-ink-soft">Shell model</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {SHELL_MODELS.map((m) => (
            <label key={m} className={`flex cursor-pointer gap-2 rounded-md border p-2 text-sm ${values.model === m ? "border-moss bg-moss-light/50" : "border-paper-line"}`}>
              <input type="radio" value={m} {...register(`${which}.model`)} className="mt-1" />
              <span><span className="font-medium">{MODEL_LABELS[m]}</span><span className="block text-xs text-ink-muted">{MODEL_DESCRIPTIONS[m]}</span></span>
            </label>
          ))}
        </div>
      </fieldset>

      {MODEL_LAYOUT[values.model].map((group) => (
        <fieldset key={group.layer} className="rounded-md border border-paper-line p-3">
          <legend className="px-1 text-sm font-semibold">{group.layer}</legend>
          <div className="space-y-3">
            {group.fields.map((f) => {
              const spec = POPULATION_FIELDS[f];
              const hint = `${rangeInWords(spec)}${"hint" in spec ? `. ${spec.hint}` : ""}`;
              if (PLAIN_FIELDS.includes(f)) {
                return <NumField key={f} id={id(f)} label={labelWithUnit(spec)} registration={reg(f)} error={err(f)} hint={hint} />;
              }
              return (
                <div key={f} className="grid gap-2 sm:grid-cols-[2fr_1fr_1fr]">
                  <NumField id={id(`${f}.mean`)} label={`${labelWithUnit(spec)}, mean`} registration={reg(`${f}.mean`)} error={err(`${f}.mean`)} hint={hint} />
                  <NumField id={id(`${f}.cv`)} label="Spread, CV (%)" registration={reg(`${f}.cv`)} error={err(`${f}.cv`)} hint="0–100 %" />
                  <div className="field">
                    <label htmlFor={id(`${f}.distribution`)} className="mb-1 block font-medium text-ink-soft">Distribution</label>
                    <select id={id(`${f}.distribution`)} className="input" {...reg(`${f}.distribution`, false)}>
                      <option value="normal">Normal</option>
                      <option value="lognormal">Log-normal</option>
                    </select>
                  </div>
                </div>
              );
            })}
          </div>
        </fieldset>
      ))}
    </fieldset>
  );
}
