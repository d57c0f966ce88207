"use client";

import { DeviceEditor } from "@/components/devices/device-editor";
import { deviceFormSchema, type DeviceForm as FormValues } from "@/lib/library/devices/content";
import { SubmitRow } from "./form-bits";
import { useItemForm } from "./use-item-form";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";

/** Create or edit a device profile in lab units with the shared device editor. */
export function DeviceForm({ defaults, editing }: { defaults: FormValues; editing: EditingInfo | null }) {
  const { form, status, submit } = useItemForm<FormValues>("devices", deviceFormSchema, defaults, editing);
  const { register, watch, formState: { errors, isSubmitting } } = form;
  const v = watch();


  return (
    <form onSubmit={submit} noValidate className="space-y-5">
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
      <div className="card space-y-4">
        <DeviceEditor values={v} register={register} errors={errors} />
        <label className="field">
          <span>Notes</span>
          <textarea className="input" rows={2} {...register("notes")} />
          {errors.notes && <p className="field-error">{errors.notes.message}</p>}
        </label>
      </div>
      <VersionMetaFields register={register as never} errors={errors} editing={editing} />
      <SubmitRow label={editing ? "Save" : "Create device profile"} busy={isSubmitting} status={status} hasErrors={Object.keys(errors).length > 0} />
    </form>
  );
}
