"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { DeviceEditor } from "@/components/devices/device-editor";
import { DEVICE_FIELDS } from "@/lib/devices/fields";
import { formatVelocity } from "@/lib/units/format";
import { deviceStepSchema, libraryDeviceToStep, meanFlowSpeed, STEP_FIELD_OF, type DeviceStepValues, type LibraryDeviceContent } from "@/lib/wizard/device-form";
import { labelWithUnit, rangeInWords, readNumber } from "@/lib/units/lab-fields";
import { errorAt, NumField } from "@/components/forms/num-field";
import { StepFooter } from "./step-footer";
import { useAutosave } from "./use-autosave";

type Key = keyof typeof STEP_FIELD_OF;

/** Step 3: the shared device editor (electrodes or own Γ, generator), then what the drive is sized for and the operating temperature. */
export function DeviceStep({ draftId, initial, library }: { draftId: number; initial: DeviceStepValues; library: { id: number; version: number; name: string; content: LibraryDeviceContent }[] }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, control, handleSubmit, reset, getValues, formState: { errors, isSubmitting } } = useForm<DeviceStepValues>({ resolver: zodResolver(deviceStepSchema) as never, defaultValues: initial, mode: "onChange" });
  const values = useWatch({ control }) as DeviceStepValues;
  const { state, saveNow } = useAutosave(draftId, "device", values);
  const num = (key: Key) => {
    const f = DEVICE_FIELDS[STEP_FIELD_OF[key]];
    return <NumField id={`device-${key}`} label={labelWithUnit(f)} registration={register(key, { setValueAs: readNumber })} error={errorAt(errors, key)} hint={`${rangeInWords(f)}. ${f.help}`} />;
  };
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

        <DeviceEditor values={values} register={register} errors={errors} withEvalHeight frequencyOptional generatorExtra={num("operatingTemperatureC")} />

        <fieldset className="space-y-3 rounded-md border border-paper-line p-3">
          <legend className="px-1 text-sm font-semibold">Drive</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2"><input type="radio" value="speed" {...register("drive")} /> Size the voltage for a DEP speed</label>
            <label className="flex items-center gap-2"><input type="radio" value="flow" {...register("drive")} /> Size it for a flow rate through the channel</label>
          </div>
          <div className="grid gap-3 sm:grid-cols-3">
            {values.drive === "speed" ? num("targetSpeed") : <>{num("flowRate")}{num("channelWidth")}{num("arrayLength")}</>}
          </div>
          {flow !== null && <p className="text-sm">Mean flow speed {formatVelocity(flow)}; the cells must be moved across the channel while they pass the array.</p>}
        </fieldset>
      </div>
      <StepFooter backHref={`/planner/${draftId}/buffer`} nextLabel="Next: limits" state={state} busy={isSubmitting} formError={formError} />
    </form>
  );
}
