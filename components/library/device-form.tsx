"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { DeviceEditor } from "@/components/devices/device-editor";
import { saveLibraryItemAction } from "@/lib/library/actions";
import { deviceFormSchema, type DeviceForm as FormValues } from "@/lib/library/devices/content";
import { SubmitRow } from "./form-bits";
import { applyServerErrors } from "./save-result";
import { VersionMetaFields, type EditingInfo } from "./version-meta-fields";

/** Create or edit a device profile in lab units with the shared device editor. */
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
