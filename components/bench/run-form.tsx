"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type FieldPath } from "react-hook-form";
import type { z } from "zod";
import { FREQUENCY_RANGE_TEXT, RUN_LIMITS, runFormSchema, toRunRecord } from "@/lib/runs/schemas";
import type { FrequencyUnit } from "@/lib/units/format";
import { formatMeterConductivity } from "@/lib/units/format";
import { useHydrated } from "@/components/forms/use-hydrated";

type In = z.input<ReturnType<typeof runFormSchema>>;
type Out = z.output<ReturnType<typeof runFormSchema>>;
type NumberField = Exclude<keyof typeof RUN_LIMITS, "frequencyHz" | "frequencyKHz">;

/** Planned settings used to prefill the form (lab units); the technician changes what differed. */
export interface RunDefaults {
  operatingTemperatureC: number;
  /** The planned frequency in the unit the bench sheet prints it in (see `frequencyEntry`). */
  frequency: { unit: FrequencyUnit; value: number };
  voltageVpp: number;
  flowRateUlPerMin: number | null;
  /** The sheet's limit on minutes in the low-conductivity buffer, shown as a hint. */
  maxMinutesInBuffer: number;
}

function NumberInput({ name, register, error, optional, hint }: { name: NumberField; register: ReturnType<typeof useForm<In, unknown, Out>>["register"]; error?: string; optional?: boolean; hint?: string }) {
  const l = RUN_LIMITS[name];
  return (
    <label className="field">
      <span>{l.label} ({l.unit}){optional ? ", optional" : ""}</span>
      <input className="input" inputMode="decimal" aria-invalid={Boolean(error)} {...register(name)} />
      <p className="hint">{l.min} to {l.max} {l.unit}{hint ? `; ${hint}` : ""}</p>
      {error && <p className="field-error">{error}</p>}
    </label>
  );
}

/** The record-a-run form: measured values, observations and attachments, checked in the browser and again on the server. */
export function RunForm({ versionId, defaults, maxUploadMb }: { versionId: number; defaults: RunDefaults; maxUploadMb: number }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [files, setFiles] = useState<File[]>([]);
  const [fileInputKey, setFileInputKey] = useState(0);
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const initial: In = {
    versionId,
    bufferLot: "",
    conductivityUsPerCm: "",
    measuredAtC: "",
    osmolalityMOsmPerKg: "",
    operatingTemperatureC: String(defaults.operatingTemperatureC),
    frequency: String(defaults.frequency.value),
    voltageVpp: String(defaults.voltageVpp),
    flowRateUlPerMin: defaults.flowRateUlPerMin === null ? "" : String(defaults.flowRateUlPerMin),
    minutesInBuffer: "",
    recoveryPercent: "",
    purityPercent: "",
    countingMethod: "",
    deviations: "",
    notes: "",
  };
  const { register, handleSubmit, setError, reset, formState: { errors, isSubmitting } } = useForm<In, unknown, Out>({
    resolver: zodResolver(runFormSchema(defaults.frequency.unit)),
    defaultValues: initial,
  });
  const msg = (k: keyof In) => errors[k]?.message as string | undefined;

  async function onSubmit(values: Out) {
    setStatus(null);
    setFileError(null);
    const body = new FormData();
    body.set("run", JSON.stringify(toRunRecord(values, defaults.frequency.unit)));
    for (const f of files) body.append("attachments", f);
    const res = await fetch("/api/v1/runs", { method: "POST", body });
    const json = await res.json().catch(() => ({}));
    if (!res.ok) {
      const issues: { path: string; message: string }[] = json.issues ?? [];
      const fileIssues = issues.filter((i) => i.path === "attachments").map((i) => i.message);
      if (fileIssues.length) setFileError(fileIssues.join(" "));
      for (const i of issues) {
        const field = i.path === "frequencyHz" ? "frequency" : i.path;
        if (field in initial) setError(field as FieldPath<In>, { message: i.message });
      }
      setStatus({ ok: false, text: `${json.message ?? `The server refused the run (${res.status}).`} Nothing was saved.` });
      return;
    }
    const run = json.run;
    reset(initial);
    setFiles([]);
    setFileInputKey((k) => k + 1);
    setStatus({
      ok: true,
      text: `Run recorded. Conductivity ${run.conductivityAccepted ? "within" : "OUTSIDE"} the acceptance range (${formatMeterConductivity(run.conductivity25)} at 25 °C).`,
    });
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="space-y-5" noValidate data-testid="run-form">
      <input type="hidden" {...register("versionId")} />
      <fieldset className="grid gap-4 sm:grid-cols-4">
        <legend className="mb-2 font-medium">Buffer</legend>
        <label className="field">
          <span>Buffer lot</span>
          <input className="input" aria-invalid={Boolean(errors.bufferLot)} {...register("bufferLot")} />
          {errors.bufferLot && <p className="field-error">{errors.bufferLot.message}</p>}
        </label>
        <NumberInput name="conductivityUsPerCm" register={register} error={msg("conductivityUsPerCm")} />
        <NumberInput name="measuredAtC" register={register} error={msg("measuredAtC")} />
        <NumberInput name="osmolalityMOsmPerKg" register={register} error={msg("osmolalityMOsmPerKg")} optional />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-5">
        <legend className="mb-2 font-medium">Settings used</legend>
        <NumberInput name="operatingTemperatureC" register={register} error={msg("operatingTemperatureC")} />
        <label className="field">
          <span>Frequency ({defaults.frequency.unit})</span>
          <input className="input" inputMode="decimal" aria-invalid={Boolean(errors.frequency)} data-testid="run-frequency" {...register("frequency")} />
          <p className="hint">{FREQUENCY_RANGE_TEXT}; in {defaults.frequency.unit} as on the bench sheet</p>
          {errors.frequency && <p className="field-error">{errors.frequency.message}</p>}
        </label>
        <NumberInput name="voltageVpp" register={register} error={msg("voltageVpp")} />
        <NumberInput name="flowRateUlPerMin" register={register} error={msg("flowRateUlPerMin")} optional />
        <NumberInput name="minutesInBuffer" register={register} error={msg("minutesInBuffer")} optional hint={`from first contact with the low-conductivity buffer; the sheet allows ${defaults.maxMinutesInBuffer} min`} />
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 font-medium">Observed</legend>
        <NumberInput name="recoveryPercent" register={register} error={msg("recoveryPercent")} optional />
        <NumberInput name="purityPercent" register={register} error={msg("purityPercent")} optional />
        <label className="field">
          <span>Counting method</span>
          <input className="input" placeholder="e.g. flow cytometry, PI stain" aria-invalid={Boolean(errors.countingMethod)} {...register("countingMethod")} />
          {errors.countingMethod && <p className="field-error">{errors.countingMethod.message}</p>}
        </label>
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <label className="field">
          <span>Deviations from the bench sheet</span>
          <textarea className="input" rows={3} {...register("deviations")} />
          {errors.deviations && <p className="field-error">{errors.deviations.message}</p>}
        </label>
        <label className="field">
          <span>Notes</span>
          <textarea className="input" rows={3} {...register("notes")} />
          {errors.notes && <p className="field-error">{errors.notes.message}</p>}
        </label>
      </div>
      <label className="field">
        <span>Attachments (optional)</span>
        <input key={fileInputKey} onChange={(e) => setFiles(Array.from(e.target.files ?? []))} className="input" type="file" name="attachments" multiple accept=".png,.jpg,.jpeg,.csv,.pdf,image/png,image/jpeg,text/csv,application/pdf" data-testid="run-attachments" />
        <p className="hint">PNG or JPEG images, CSV tables, PDF; up to 5 files of {maxUploadMb} MB each. Files are checked by their content.</p>
        {fileError && <p className="field-error" data-testid="attachments-error">{fileError}</p>}
      </label>
      <div className="flex items-center gap-3">
        <button className="btn" type="submit" disabled={!hydrated || isSubmitting}>{isSubmitting ? "Saving…" : "Record run"}</button>
        {status && <p className={`text-sm ${status.ok ? "text-moss-dark" : "text-danger"}`} role="status" data-testid="run-status">{status.text}</p>}
      </div>
    </form>
  );
}
