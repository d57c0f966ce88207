"use client";

import type { FieldErrors, FieldValues, UseFormRegister } from "react-hook-form";
import { errorAt, NumField } from "@/components/forms/num-field";
import { layersOf, MODEL_DESCRIPTIONS, MODEL_LABELS, SHELL_MODELS, type PopulationField, type ShellModel } from "@/lib/populations/fields";
import { labelWithUnit, rangeInWords } from "@/lib/units/lab-fields";

/**
 * The one population editor (library form and planner step): the shell model, then each parameter of that model in
 * its lab unit, grouped by layer, with its spread (CV in %) and distribution. Values live in the caller's
 * react-hook-form at `prefix` (e.g. "target" → "target.radius.mean"; "" for the form's top level).
 */
export function PopulationEditor<T extends FieldValues>({ prefix, idPrefix, model, register, errors }: {
  prefix: string;
  /** Prefix of element ids, e.g. "target" → "target-radius-mean". */
  idPrefix: string;
  model: ShellModel;
  register: UseFormRegister<T>;
  errors: FieldErrors<T>;
}) {
  const full = (path: string) => (prefix ? `${prefix}.${path}` : path);
  const id = (path: string) => `${idPrefix}-${path.replace(/\./g, "-")}`;
  const reg = (path: string, asNumber = true) => register(full(path) as never, asNumber ? { valueAsNumber: true } : undefined);
  const err = (path: string) => errorAt(errors, full(path));
  const hint = (f: PopulationField) => `${rangeInWords(f)}. ${f.help}`;

  return (
    <div className="space-y-4">
      <fieldset>
        <legend className="mb-1 text-sm font-medium text-ink-soft">Shell model</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {SHELL_MODELS.map((m) => (
            <label key={m} className={`flex cursor-pointer gap-2 rounded-md border p-2 text-sm ${model === m ? "border-moss bg-moss-light/50" : "border-paper-line"}`}>
              <input type="radio" value={m} {...register(full("model") as never)} className="mt-1" />
              <span><span className="font-medium">{MODEL_LABELS[m]}</span><span className="block text-xs text-ink-muted">{MODEL_DESCRIPTIONS[m]}</span></span>
            </label>
          ))}
        </div>
        {err("model") && <p className="field-error">{err("model")}</p>}
      </fieldset>
      <p className="hint">Mean in the unit shown; spread as a coefficient of variation (10 % means the standard deviation is a tenth of the mean).</p>
      {layersOf(model).map((group) => (
        <fieldset key={group.layer} className="rounded-md border border-paper-line p-3">
          <legend className="px-1 text-sm font-semibold">{group.layer}</legend>
          <div className="space-y-3">
            {group.fields.map((f) => {
              const label = `${labelWithUnit(f)}${f.optional ? ", optional" : ""}`;
              if (!f.spread) return <NumField key={f.path} id={id(f.path)} label={label} registration={reg(f.path)} error={err(f.path)} hint={hint(f)} />;
              return (
                <div key={f.path} className="grid gap-2 sm:grid-cols-[2fr_1fr_1fr]">
                  <NumField id={id(`${f.path}.mean`)} label={`${label}, mean`} registration={reg(`${f.path}.mean`)} error={err(`${f.path}.mean`)} hint={hint(f)} />
                  <NumField id={id(`${f.path}.cv`)} label="Spread, CV (%)" registration={reg(`${f.path}.cv`)} error={err(`${f.path}.cv`)} hint="0–100 %" />
                  <div className="field">
                    <label htmlFor={id(`${f.path}.distribution`)} className="mb-1 block font-medium text-ink-soft">Distribution</label>
                    <select id={id(`${f.path}.distribution`)} className="input" {...reg(`${f.path}.distribution`, false)}>
                      <option value="normal">Normal</option>
                      <option value="lognormal">Log-normal</option>
                    </select>
                    {err(`${f.path}.distribution`) && <p className="field-error">{err(`${f.path}.distribution`)}</p>}
                  </div>
                </div>
              );
            })}
          </div>
        </fieldset>
      ))}
    </div>
  );
}
