"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { interdigitatedField } from "@/lib/dielectric";
import { sig } from "@/lib/units/number";
import { DEVICE_FIELDS } from "@/lib/devices/fields";
import { deviceStepSchema, libraryDeviceToStep, meanFlowSpeed, STEP_FIELD_OF, type DeviceStepValues, type LibraryDeviceContent } from "@/lib/wizard/device-form";
import { labelWithUnit, rangeInWords } from "@/lib/units/lab-fields";
import { errorAt, NumField } from "@/components/forms/num-field";
import { StepFooter } from "./step-footer";
import { useAutosave } from "./use-autosave";

type Key = keyof typeof STEP_FIELD_OF;
const field = (key: Key) => DEVICE_FIELDS[STEP_FIELD_OF[key]];

/** Step 3: electrodes (preset or own Γ), generator limit, what the drive is sized for, operating temperature. */
export function DeviceStep({ draftId, initial, library }: { draftId: number; initial: DeviceStepValues; library: { id: number; version: number; name: string; content: LibraryDeviceContent }[] }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, reset, getValues, formState: { errors, isSubmitting } } = useForm<DeviceStepValues>({ resolver: zodResolver(deviceStepSchema) as never, defaultValues: initial, mode: "onChange" });
  const values = useWatch({ control }) as DeviceStepValues;
  const { state, saveNow } = useAutosave(draftId, "device", values);
  const num = (key: Key, optional = false) => {
    const f = field(key);
    return <NumField id={`device-${key}`} label={`${labelWithUnit(f)}${optional ? ", optional" : ""}`} registration={register(key, { valueAsNumber: true })} error={errorAt(errors, key)} hint={`${rangeInWords(f)}. ${f.help}`} />;
  };
  let gammaText = "—";
  try {
    if (values.geometry === "interdigitated") gammaText = `${sig(interdigitatedField(values.electrodeWidth * 1e-6, values.electrodeGap * 1e-6, values.evalHeight * 1e-6).gamma, 3)} m⁻³ (interdigitated preset, fundamental mode)`;
    else if (Number.isFinite(values.gamma)) gammaText = `${sig(values.gamma, 3)} m⁻³ (your value)`;
  } catch {
    gammaText = "— (check the dimensions)";
  }
  const flow = values.drive === "flow" && [values.flowRate, values.channelWidth, values.channelHeight].every(Number.isFinite) ? meanFlowSpeed(values.flowRate, values.channelWidth, values.channelHeight) : null;

  async function onValid() {
    setFormError(null);
    if (await saveNow("limits")) router.push(`/planner/${draftId}/limits`);
  }

  return (
    <form onSubmit={handleSubmit(onValid, () => setFormError("Some fields need attention; each says what is allowed."))} noValidate className="space-y-6">
      <div className="card space-y-4">
        <div className="grid gap-4 sm:grid-cols-2">
          <div className="field">
            <label htmlFor="device-pick" className="mb-1 block font-medium text-ink-soft">Start from a library device profile</label>
            <select id="device-pick" className="input" defaultValue="" onChange={(e) => {
              const item = library.find((l) => String(l.id) === e.target.value);
              if (item) reset(libraryDeviceToStep(item.content, { id: item.id, version: item.version }, getValues()));
            }}>
              <option value="">— keep what is below —</option>
              {library.map((l) => <option key={l.id} value={l.id}>{l.name} (v{l.version})</option>)}
            </select>
            <p className="hint">{library.length === 0 ? "The device library is empty; describe the device here." : "Copies the profile; editing here does not change the library."}</p>
          </div>
          <div className="field">
            <label htmlFor="device-name" className="mb-1 block font-medium text-ink-soft">Device name</label>
            <input id="device-name" className="input" {...register("name")} />
            {errorAt(errors, "name") && <p className="field-error">{errorAt(errors, "name")}</p>}
          </div>
        </div>

        <fieldset className="space-y-3 rounded-md border border-paper-line p-3">
          <legend className="px-1 text-sm font-semibold">Electrodes and field gradient</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2"><input type="radio" value="interdigitated" {...register("geometry")} /> Interdigitated electrodes (preset)</label>
            <label className="flex items-center gap-2"><input type="radio" value="user" {...register("geometry")} /> My own field-gradient factor Γ</label>
          </div>
          <div className="grid gap-3 sm:grid-cols-3">
            {values.geometry === "interdigitated" ? <>{num("electrodeWidth")}{num("electrodeGap")}{num("evalHeight")}</> : <>{num("gamma")}{num("electrodeGap")}
              <div className="field">
                <label htmlFor="device-gammaSource" className="mb-1 block font-medium text-ink-soft">Where Γ comes from</label>
                <input id="device-gammaSource" className="input" {...register("gammaSource")} aria-invalid={errorAt(errors, "gammaSource") ? true : undefined} placeholder="e.g. FEM model of chip rev. C, 2026-11" />
                {errorAt(errors, "gammaSource") && <p className="field-error">{errorAt(errors, "gammaSource")}</p>}
              </div></>}
            {num("channelHeight")}
          </div>
          <p className="text-sm" data-testid="gamma-readout">Γ used: <strong>{gammaText}</strong>. ∇|E_rms|² = Γ·V_rms²; the field in the gap is taken as V / gap.</p>
        </fieldset>

        <fieldset className="space-y-3 rounded-md border border-paper-line p-3">
          <legend className="px-1 text-sm font-semibold">Generator and drive</legend>
          <div className="grid gap-3 sm:grid-cols-3">{num("maxVoltageVpp")}{num("operatingTemperatureC")}</div>
          <div className="grid gap-3 sm:grid-cols-3">{num("minFrequency", true)}{num("maxFrequency", true)}</div>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2"><input type="radio" value="speed" {...register("drive")} /> Size the voltage for a DEP speed</label>
            <label className="flex items-center gap-2"><input type="radio" value="flow" {...register("drive")} /> Size it for a flow rate through the channel</label>
          </div>
          <div className="grid gap-3 sm:grid-cols-3">
            {values.drive === "speed" ? num("targetSpeed") : <>{num("flowRate")}{num("channelWidth")}{num("arrayLength")}</>}
          </div>
          {flow !== null && <p className="text-sm">Mean flow speed {sig(flow * 1e6, 3)} µm/s; the cells must be moved across the channel while they pass the array.</p>}
        </fieldset>
      </div>
      <StepFooter backHref={`/planner/${draftId}/buffer`} nextLabel="Next: limits" state={state} busy={isSubmitting} formError={formError} />
    </form>
  );
}
