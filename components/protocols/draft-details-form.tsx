"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { saveDraftDetailsAction } from "@/lib/protocols/actions";
import { draftDetailsSchema, type DraftDetailsInput } from "@/lib/protocols/schemas";
import { ActionStatus } from "./action-status";
import { useHydrated } from "@/components/forms/use-hydrated";

/** Edits a draft's bench handling (lab units). A stale page is refused by the server with a conflict message. */
export function DraftDetailsForm({ defaults, returned }: { defaults: DraftDetailsInput; returned: boolean }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<DraftDetailsInput>({
    resolver: zodResolver(draftDetailsSchema),
    defaultValues: defaults,
  });

  async function onSubmit(values: DraftDetailsInput) {
    const r = await saveDraftDetailsAction(values);
    for (const [field, message] of Object.entries(r.ok ? {} : r.fieldErrors ?? {})) {
      if (field in values) setError(field as keyof DraftDetailsInput, { message });
    }
    setStatus({ ok: r.ok, text: r.message ?? "" });
    if (r.ok) router.refresh();
  }

  const field = (name: keyof DraftDetailsInput, label: string, hint?: string, type = "number") => (
    <label className="field">
      <span>{label}</span>
      <input className="input" type={type} step="any" {...register(name)} />
      {hint && <p className="hint">{hint}</p>}
      {errors[name] && <p className="field-error">{String(errors[name]?.message)}</p>}
    </label>
  );

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {returned && <p className="notice">Saving reopens this returned version as a draft; submit it again when it is ready.</p>}
      <input type="hidden" {...register("versionId")} />
      <input type="hidden" {...register("lockVersion")} />
      <div className="grid gap-4">
        {field("washes", "Washes", "Whole number, 0 to 10.")}
        {field("resuspensionMillionsPerMl", "Resuspension density (million cells/mL)")}
        {field("tolerancePercent", "Conductivity tolerance (%)", "Accepted deviation of the measured buffer conductivity, 1 to 50 %.")}
        {field("maxMinutesInBuffer", "Longest time in buffer (min)")}
      </div>
      <label className="field">
        <span>Preparation notes</span>
        <textarea className="input min-h-24" {...register("notes")} />
        {errors.notes && <p className="field-error">{errors.notes.message}</p>}
      </label>
      <div className="flex items-center gap-3">
        <button className="btn" type="submit" disabled={!hydrated || isSubmitting}>Save draft</button>
        <ActionStatus status={status} />
      </div>
    </form>
  );
}
