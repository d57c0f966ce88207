"use client";

import type { ReactNode } from "react";
import type { FieldErrors, FieldValues, UseFormRegister } from "react-hook-form";
import { errorAt, NumField } from "@/components/forms/num-field";
import { DEVICE_FIELDS } from "@/lib/devices/fields";
import { DEVICE_FORM_FIELDS, GAMMA_SOURCE_LENGTH, GEOMETRIES, GEOMETRY_CHOICES, gammaReadout, type DeviceFormKey, type DeviceFormValues } from "@/lib/devices/form";
import { labelWithUnit, rangeInWords, readNumber } from "@/lib/units/lab-fields";

/**
 * The one device editor (library device profile and planner step 3): the electrode geometry (interdigitated preset
 * or the user's own Γ with its source), the channel height, the Γ the planner will use, and the generator limits.
 * Every number is a row of the device field table (label, lab unit, range, help). Values live at the top level of
 * the caller's react-hook-form under the keys of `DeviceFormValues`.
 */
export function DeviceEditor<T extends FieldValues>({ values, register, errors, withEvalHeight = false, frequencyOptional = false, generatorExtra }: {
  /** The watched form values (for the geometry switch and the Γ read-out). */
  values: Partial<DeviceFormValues>;
  register: UseFormRegister<T>;
  errors: FieldErrors<T>;
  /** Ask the height above the electrodes where cells are judged (the planner); else Γ is given half a gap up. */
  withEvalHeight?: boolean;
  /** The generator's frequency range may be left empty (the planner). */
  frequencyOptional?: boolean;
  /** More fields in the generator row (the planner's operating temperature). */
  generatorExtra?: ReactNode;
}) {
  const num = (key: DeviceFormKey, optional = false) => {
    const f = DEVICE_FIELDS[DEVICE_FORM_FIELDS[key]];
    return <NumField id={`device-${key}`} label={`${labelWithUnit(f)}${optional ? ", optional" : ""}`} registration={register(key as never, { setValueAs: readNumber })} error={errorAt(errors, key)} hint={`${rangeInWords(f)}. ${f.help}`} />;
  };
  const sourceError = errorAt(errors, "gammaSource");

  return (
    <div className="space-y-4">
      <fieldset className="space-y-3 rounded-md border border-paper-line p-3">
        <legend className="px-1 text-sm font-semibold">Electrodes and field gradient</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          {GEOMETRIES.map((g) => (
            <label key={g} className="flex items-center gap-2"><input type="radio" value={g} {...register("geometry" as never)} /> {GEOMETRY_CHOICES[g]}</label>
          ))}
        </div>
        {errorAt(errors, "geometry") && <p className="field-error">{errorAt(errors, "geometry")}</p>}
        <div className="grid gap-3 sm:grid-cols-3">
          {values.geometry === "user" ? (
            <>
              {num("gamma")}
              {num("electrodeGap")}
              <div className="field">
                <label htmlFor="device-gammaSource" className="mb-1 block font-medium text-ink-soft">Where Γ comes from</label>
                <input id="device-gammaSource" className="input" maxLength={GAMMA_SOURCE_LENGTH.max} {...register("gammaSource" as never)} aria-invalid={sourceError ? true : undefined} placeholder="e.g. own field simulation of the chip, averaged 5–15 µm above the electrodes" />
                {sourceError && <p className="field-error">{sourceError}</p>}
              </div>
            </>
          ) : (
            <>
              {num("electrodeWidth")}
              {num("electrodeGap")}
              {withEvalHeight && num("evalHeight")}
            </>
          )}
          {num("channelHeight")}
        </div>
        <p className="text-sm" aria-live="polite" data-testid="gamma-readout">Γ used: <strong>{gammaReadout(values)}</strong>. ∇|E_rms|² = Γ·V_rms²; the field in the gap is taken as V / gap.</p>
      </fieldset>

      <fieldset className="space-y-3 rounded-md border border-paper-line p-3">
        <legend className="px-1 text-sm font-semibold">Generator</legend>
        <div className="grid gap-3 sm:grid-cols-3">{num("maxVoltageVpp")}{generatorExtra}</div>
        <div className="grid gap-3 sm:grid-cols-3">{num("minFrequency", frequencyOptional)}{num("maxFrequency", frequencyOptional)}</div>
      </fieldset>
    </div>
  );
}
