"use client";

import type { ReactNode } from "react";
import { useFieldArray, type Control, type FieldErrors, type FieldValues, type UseFormRegister } from "react-hook-form";
import { errorAt, NumField } from "@/components/forms/num-field";
import { BUFFER_FORM_FIELDS, type BufferFormKey } from "@/lib/buffers/form";
import { ADDITION_KINDS, additionUnitLabel, amountUnit, type AdditionKind, type RecipeValues } from "@/lib/buffers/recipe";
import type { BufferResult } from "@/lib/dielectric";
import { formatConductivity, formatOsmolality, formatPercentFixed, formatPlain, formatTemperature } from "@/lib/units/format";
import { formatIn, toSI } from "@/lib/units/lab";
import { labelWithUnit, rangeInWords, readNumber } from "@/lib/units/lab-fields";

/**
 * The one buffer editor (library buffer form and planner step 2), in parts the two forms arrange around their own
 * fields: the recipe (sugar base and additions), its prediction, the meter reading, and what the bench needs
 * (osmolality, tolerance, time in the buffer). Every number is a row of the buffer field table; values live at the
 * top level of the caller's react-hook-form under the keys of BUFFER_FORM_FIELDS.
 */

type FormProps<T extends FieldValues> = { register: UseFormRegister<T>; errors: FieldErrors<T> };

/**
 * One number of the buffer, labelled with its unit, its range and an optional extra hint (the field's help by
 * default). Id `buffer-<key>` unless given.
 */
export function BufferNumber<T extends FieldValues>({ name, register, errors, hint, id, optional = false }: FormProps<T> & { name: BufferFormKey; hint?: string; id?: string; optional?: boolean }) {
  const f = BUFFER_FORM_FIELDS[name];
  const extra = hint ?? f.help;
  return (
    <NumField id={id ?? `buffer-${name}`} label={`${labelWithUnit(f)}${optional ? ", optional" : ""}`} registration={register(name as never, { setValueAs: readNumber })} error={errorAt(errors, name)}
      hint={`${rangeInWords(f)}${extra ? `. ${extra}` : ""}`} step={"integer" in f && f.integer ? 1 : "any"} />
  );
}

/** The recipe: sugar base and the salts and stocks per litre of it. `batch` adds the planner's volume and temperature. */
export function RecipeFields<T extends FieldValues>({ register, errors, control, values, batch }: FormProps<T> & { control: Control<T>; values: Partial<RecipeValues>; batch?: ReactNode }) {
  const additions = useFieldArray({ control, name: "additions" as never });
  const kindOf = (i: number): AdditionKind => values.additions?.[i]?.kind ?? "PBS1x";
  return (
    <fieldset className="space-y-3 rounded-md border border-paper-line p-3">
      <legend className="px-1 text-sm font-semibold">Recipe</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        {batch}
        <BufferNumber name="sucrosePercentWV" id="buffer-sucrose" register={register} errors={errors} />
        <BufferNumber name="glucosePercentWV" id="buffer-glucose" register={register} errors={errors} />
      </div>
      <div>
        <p className="mb-1 text-sm font-medium text-ink-soft">Salt and stock additions, per litre of sugar base</p>
        <ul className="space-y-2">
          {additions.fields.map((f, i) => (
            <li key={f.id} className="grid items-start gap-2 sm:grid-cols-[3fr_2fr_auto]">
              <div className="field">
                <label htmlFor={`buffer-add-${i}-kind`} className="sr-only">Addition {i + 1}</label>
                <select id={`buffer-add-${i}-kind`} className="input" {...register(`additions.${i}.kind` as never)}>
                  {ADDITION_KINDS.map((k) => <option key={k} value={k}>{additionUnitLabel(k)}</option>)}
                </select>
              </div>
              <NumField id={`buffer-add-${i}-amount`} label={`Amount of addition ${i + 1} (${amountUnit(kindOf(i))} per litre)`} registration={register(`additions.${i}.perLitre` as never, { setValueAs: readNumber })} error={errorAt(errors, `additions.${i}.perLitre`)} hint={rangeInWords(BUFFER_FORM_FIELDS.perLitre)} />
              <button type="button" className="btn-quiet mt-6" onClick={() => additions.remove(i)} aria-label={`Remove addition ${i + 1}`}>Remove</button>
            </li>
          ))}
        </ul>
        <button type="button" className="btn-quiet mt-2" onClick={() => additions.append({ kind: "PBS1x", perLitre: BUFFER_FORM_FIELDS.perLitre.default } as never)}>Add a salt or stock</button>
        {errorAt(errors, "additions") && <p className="field-error">{errorAt(errors, "additions")}</p>}
      </div>
    </fieldset>
  );
}

/**
 * The engine's prediction for a recipe: conductivity at 25 °C (and at the batch temperature when one is given),
 * osmolality, viscosity, the final volume of a batch, the deviation from a target and the calculator's warnings.
 */
export function RecipePrediction({ result, error, temperatureC, target, finalVolume = false }: {
  result: BufferResult | null;
  error: string | null;
  /** The batch temperature, °C (adds the conductivity at it). */
  temperatureC?: number;
  /** Target conductivity at 25 °C, S/m: adds the deviation from it. */
  target?: number | null;
  finalVolume?: boolean;
}) {
  if (!result) return <p className={error ? "field-error" : "text-sm text-ink-muted"}>{error ?? "Enter the sugars to see a prediction."}</p>;
  const off = target ? result.conductivity25 / target - 1 : null;
  return (
    <div className="space-y-2">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-ink-muted">Conductivity at 25 °C</dt><dd data-testid="recipe-conductivity">{formatConductivity(result.conductivity25, { meter: true })}</dd>
        {temperatureC !== undefined && <><dt className="text-ink-muted">At {formatTemperature(temperatureC)}</dt><dd>{formatConductivity(result.conductivity, { meter: true })}</dd></>}
        <dt className="text-ink-muted">Osmolality</dt><dd data-testid="recipe-osmolality">{formatOsmolality(result.osmolality)}</dd>
        <dt className="text-ink-muted">Viscosity</dt><dd>{formatPlain(result.relativeViscosity)} × water</dd>
        {finalVolume && <><dt className="text-ink-muted">Final volume</dt><dd>{formatIn("mL", toSI("L", result.finalVolumeL))}</dd></>}
        {off !== null && <><dt className="text-ink-muted">From the target</dt><dd className={Math.abs(off) > 0.1 ? "text-caution" : "text-moss-dark"}>{formatPercentFixed(off, 0)}</dd></>}
      </dl>
      {result.warnings.map((w) => <p key={w.code} className="notice">{w.message}</p>)}
    </div>
  );
}

/** A conductivity meter reading and its temperature (converted to 25 °C with 2 %/K). */
export function MeterReadingFields<T extends FieldValues>({ register, errors, optional = false }: FormProps<T> & { optional?: boolean }) {
  return (
    <fieldset className="grid gap-3 rounded-md border border-paper-line p-3 sm:grid-cols-2">
      <legend className="px-1 text-sm font-semibold">Meter reading</legend>
      <BufferNumber name="measuredConductivity" register={register} errors={errors} optional={optional} hint={`1 mS/m = 10 µS/cm${optional ? "; leave empty if not measured yet" : ""}`} />
      <BufferNumber name="measuredAtC" register={register} errors={errors} optional={optional} hint="Converted to 25 °C with 2 %/K" />
    </fieldset>
  );
}

/** What the bench needs: measured osmolality (optional), accepted conductivity deviation, longest time in the buffer. */
export function BenchFields<T extends FieldValues>({ register, errors, children }: FormProps<T> & { children?: ReactNode }) {
  return (
    <fieldset className="grid gap-3 rounded-md border border-paper-line p-3 sm:grid-cols-3">
      <legend className="px-1 text-sm font-semibold">At the bench</legend>
      <BufferNumber name="osmolality" register={register} errors={errors} optional hint="Leave empty if not measured" />
      <BufferNumber name="tolerancePercent" id="buffer-tolerance" register={register} errors={errors} hint="" />
      <BufferNumber name="maxMinutesInBuffer" id="buffer-minutes" register={register} errors={errors} />
      {children}
    </fieldset>
  );
}
