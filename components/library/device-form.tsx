"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { saveLibraryItemAction } from "@/lib/library/actions";
import { deviceFormSchema, deviceGradient, GEOMETRY_LABELS, GEOMETRY_KINDS, type DeviceForm as FormValues } from "@/lib/library/devices/content";
import { readNumber } from "@/lib/units/lab-fields";
import { formatIn, toSI } from "@/lib/units/lab";
import { NumberField, SubmitRow } from "./form-bits";
import { applyServerErrors } from "./save-result";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";

const num = { setValueAs: readNumber };

function previewGamma(v: FormValues): string {
  const w = Number(v.electrodeWidth);
  const g = Number(v.electrodeGap);
  if (!(w > 0 && g > 0)) return "Enter width and gap to see Γ.";
  try {
    const { gamma } = deviceGradient({ name: "x", organisation: "", notes: "", generator: { maxVoltageVpp: 1, minFrequency: 1, maxFrequency: 2 }, geometry: { kind: "interdigitated", electrodeWidth: toSI("um", w), electrodeGap: toSI("um", g), channelHeight: 1e-4 } });
    return `Γ ≈ ${formatIn("per_m3", gamma, 3)} half a gap above the electrodes (fundamental mode; larger near the edges).`;
  } catch (err) {
    return err instanceof Error ? err.message : String(err);
  }
}

/** Create or edit a device profile in lab units. */
export function DeviceForm({ defaults, editing }: { defaults: FormValues; editing: EditingInfo | null }) {
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, watch, setError, formState: { errors, isSubmitting } } = useForm<FormValues>({ resolver: zodResolver(deviceFormSchema), defaultValues: defaults });
  const v = watch();

  async function onSubmit(values: FormValues) {
    const result = await saveLibraryItemAction("devices", editing ? { id: editing.id, baseVersion: editing.version } : null, values);
    setStatus({ ok: result.ok, text: applyServerErrors(result, setError) });
    if (result.ok && result.data) {
      router.push(`/library/devices/${result.data.id}`);
      router.refresh();
    }
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-5">
      <fieldset className="card grid gap-4 sm:grid-cols-2">
        <legend className="px-1 text-base font-semibold">Device profile</legend>
        <label className="field">
          <span>Name</span>
          <input className="input" {...register("name")} />
          {errors.name && <p className="field-error">{errors.name.message}</p>}
        </label>
        <label className="field">
          <span>Organisation or project</span>
          <input className="input" {...register("organisation")} />
          {errors.organisation && <p className="field-error">{errors.organisation.message}</p>}
        </label>
      </fieldset>
      <fieldset className="card space-y-4">
        <legend className="px-1 text-base font-semibold">Electrodes and field</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          {GEOMETRY_KINDS.map((k) => (
            <label key={k} className="flex items-center gap-2"><input type="radio" value={k} {...register("geometryKind")} /> {GEOMETRY_LABELS[k]}</label>
          ))}
        </div>
        <div className="grid gap-4 sm:grid-cols-3">
          {v.geometryKind === "interdigitated" && (
            <NumberField label="Electrode width" unit="µm" error={errors.electrodeWidth?.message}>
              <input className="input" inputMode="decimal" {...register("electrodeWidth", num)} />
            </NumberField>
          )}
          <NumberField label="Electrode gap" unit="µm" error={errors.electrodeGap?.message}>
            <input className="input" inputMode="decimal" {...register("electrodeGap", num)} />
          </NumberField>
          <NumberField label="Channel height" unit="µm" error={errors.channelHeight?.message}>
            <input className="input" inputMode="decimal" {...register("channelHeight", num)} />
          </NumberField>
        </div>
        {v.geometryKind === "interdigitated" ? (
          <p className="text-sm text-ink-soft" aria-live="polite">{previewGamma(v)}</p>
        ) : (
          <div className="grid gap-4 sm:grid-cols-[16rem_1fr]">
            <NumberField label="Field-gradient factor Γ" unit="m⁻³" error={errors.gradientFactor?.message} hint="∇|E_rms|² = Γ·V_rms², e.g. 2.4e14">
              <input className="input" inputMode="decimal" {...register("gradientFactor", num)} />
            </NumberField>
            <label className="field">
              <span>Source of Γ</span>
              <input className="input" {...register("gradientSource")} placeholder="e.g. own field simulation of the chip, averaged 5–15 µm above the electrodes" />
              {errors.gradientSource && <p className="field-error">{errors.gradientSource.message}</p>}
            </label>
          </div>
        )}
      </fieldset>
      <fieldset className="card grid gap-4 sm:grid-cols-3">
        <legend className="px-1 text-base font-semibold">Generator limits</legend>
        <NumberField label="Highest voltage" unit="Vpp" error={errors.maxVoltageVpp?.message}>
          <input className="input" inputMode="decimal" {...register("maxVoltageVpp", num)} />
        </NumberField>
        <NumberField label="Lowest frequency" unit="kHz" error={errors.minFrequencyKHz?.message}>
          <input className="input" inputMode="decimal" {...register("minFrequencyKHz", num)} />
        </NumberField>
        <NumberField label="Highest frequency" unit="MHz" error={errors.maxFrequencyMHz?.message}>
          <input className="input" inputMode="decimal" {...register("maxFrequencyMHz", num)} />
        </NumberField>
        <label className="field sm:col-span-3">
          <span>Notes</span>
          <textarea className="input" rows={2} {...register("notes")} />
          {errors.notes && <p className="field-error">{errors.notes.message}</p>}
        </label>
      </fieldset>
      <VersionMetaFields register={register as never} errors={errors} editing={editing} />
      <SubmitRow label={editing ? "Save" : "Create device profile"} busy={isSubmitting} status={status} hasErrors={Object.keys(errors).length > 0} />
    </form>
  );
}
