"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { CROSSOVER_CSV_COLUMNS, listUnits, parseCrossoverCsv, type CrossoverCsvResult, type MembraneFit } from "@/lib/fitting";
import { InputError } from "@/lib/errors";
import { runCrossoverFit, type CrossoverFitRequest } from "@/lib/library/fit-run";
import { formatIn, fromSI, toSI } from "@/lib/units/lab";
import { decimals, tidy } from "@/lib/units/number";
import { FitCurveChart, ResidualsChart } from "./fit-charts";

interface Props {
  id: number;
  baseVersion: number;
  name: string;
  radiusUm: number;
  currentC: number;
  currentG: number;
  exampleCsv: string;
  /** The population's cytoplasm and membrane thickness, used by the full shell model. */
  shell?: CrossoverFitRequest["shell"];
}

/** The fitted model in words, numbers through the units module. */
function modelLine(fit: MembraneFit): string {
  const m = fit.modelUsed;
  if (m.kind === "closed-form" || !m.cytoplasm || m.membraneThickness === null || m.mediumPermittivity === null) return fit.model;
  return (
    `Full single-shell model (first crossover = where Re[K] turns from negative to positive, found by the engine) with cytoplasm ` +
    `εr ${formatIn("rel", m.cytoplasm.permittivity, 3)} and ${formatIn("S_m", m.cytoplasm.conductivity, 3)}, membrane ${formatIn("nm", m.membraneThickness, 3)} thick, ` +
    `medium εr ${formatIn("rel", m.mediumPermittivity, 3)}; started from the thin-membrane closed form. ${fit.intervalNote} A model prediction: verify on the bench.`
  );
}

function Estimate({ label, unit, e, testId }: { label: string; unit: "uF_cm2" | "S_m2"; e: MembraneFit["capacitance"]; testId: string }) {
  return (
    <div className="rounded-md border border-paper-line bg-paper p-3" data-testid={testId}>
      <p className="text-sm text-ink-soft">{label}</p>
      {e.fitted ? (
        <>
          <p className="text-xl font-semibold tabular-nums" data-testid={`${testId}-value`}>{formatIn(unit, e.estimate, 3)}</p>
          <p className="text-sm tabular-nums" data-testid={`${testId}-ci`}>{e.confidenceInterval ? `95 % CI ${formatIn(unit, e.confidenceInterval.lower, 3)} to ${formatIn(unit, e.confidenceInterval.upper, 3)}` : "no interval (too few points)"}</p>
          {e.relativeHalfWidth !== null && <p className="text-xs text-ink-muted">± {tidy(e.relativeHalfWidth * 100, 2)} % of the estimate</p>}
        </>
      ) : (
        <p className="text-sm">held at {formatIn(unit, e.estimate, 3)} (not fitted)</p>
      )}
    </div>
  );
}

/** Upload crossovers, see bad rows, fit C and G, look at the residuals, and save the fit as a new population version. */
export function FitWorkbench(p: Props) {
  const router = useRouter();
  const [fileName, setFileName] = useState<string | null>(null);
  const [text, setText] = useState<string>("");
  const [parsed, setParsed] = useState<CrossoverCsvResult | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [dropBad, setDropBad] = useState(false);
  const [radiusUm, setRadiusUm] = useState(String(p.radiusUm));
  const [fitG, setFitG] = useState(true);
  const [fit, setFit] = useState<MembraneFit | null>(null);
  const [fitError, setFitError] = useState<string | null>(null);
  const [note, setNote] = useState("");
  const [applyG, setApplyG] = useState(true);
  const [saving, setSaving] = useState(false);
  const [saveMsg, setSaveMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const badRows = useMemo(() => [...new Set(parsed?.errors.map((e) => e.rowNumber) ?? [])], [parsed]);
  const exampleHref = useMemo(() => `data:text/csv;charset=utf-8,${encodeURIComponent(p.exampleCsv)}`, [p.exampleCsv]);

  async function onFile(file: File | undefined) {
    setParsed(null); setFit(null); setFileError(null); setFitError(null); setSaveMsg(null); setDropBad(false);
    if (!file) return;
    const t = await file.text();
    setFileName(file.name);
    setText(t);
    try {
      setParsed(parseCrossoverCsv(t));
    } catch (err) {
      setFileError(err instanceof InputError ? err.issues.map((i) => i.message).join(" ") : err instanceof Error ? err.message : String(err));
    }
  }

  function runFit() {
    setFit(null); setFitError(null); setSaveMsg(null);
    const r = Number(radiusUm.replace(",", "."));
    try {
      const result = runCrossoverFit({ csvText: text, dropBadRows: dropBad, radius: toSI("um", r), fitConductance: fitG, shell: p.shell }).fit;
      setApplyG(result.conductance.fitted && !result.warnings.some((w) => w.parameter === "conductance" && w.code === "parameter-undetermined"));
      setFit(result);
    } catch (err) {
      setFitError(err instanceof InputError ? err.issues.map((i) => i.message).join(" ") : err instanceof Error ? err.message : String(err));
    }
  }

  async function save() {
    if (!fit || !fileName) return;
    setSaving(true);
    try {
      const res = await fetch(`/api/v1/library/populations/${p.id}/fit`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ baseVersion: p.baseVersion, fileName, csvText: text, dropBadRows: dropBad, radius: toSI("um", Number(radiusUm.replace(",", "."))), fitConductance: fitG, applyConductance: applyG, changeNote: note || undefined }),
      });
      const body = await res.json();
      if (!res.ok) {
        setSaveMsg({ ok: false, text: body.message ?? "Not saved." });
        return;
      }
      setSaveMsg({ ok: true, text: `Saved as version ${body.version}.` });
      router.push(`/library/populations/${p.id}`);
      router.refresh();
    } finally {
      setSaving(false);
    }
  }

  const blocked = parsed !== null && parsed.summary.invalidRowCount > 0 && !dropBad;
  return (
    <div className="space-y-5">
      <section className="card space-y-3">
        <h2>1. Upload crossover measurements</h2>
        <p className="text-sm text-ink-soft">
          A CSV with one row per measurement: the medium conductivity and the first (low-frequency) crossover you observed, units in brackets in the header.
          Comma, semicolon or tab separated; decimal points. Up to 10 MiB.
        </p>
        <details className="text-sm">
          <summary className="cursor-pointer font-medium">Accepted columns and an example file</summary>
          <table className="mt-2">
            <thead><tr><th>Column</th><th>Header names</th><th>Units</th><th>Example header</th></tr></thead>
            <tbody>
              {CROSSOVER_CSV_COLUMNS.map((c) => (
                <tr key={c.role}><td>{c.label}{c.required ? " (required)" : ""}</td><td>{c.names.slice(0, 4).join(", ")}{c.names.length > 4 ? ", …" : ""}</td><td>{listUnits(c)}</td><td><code>{c.example}</code></td></tr>
              ))}
            </tbody>
          </table>
          <pre className="mt-2 overflow-x-auto rounded-md bg-paper-deep p-3 text-xs" data-testid="example-csv">{p.exampleCsv}</pre>
          <a href={exampleHref} download="crossover-example.csv">Download this example</a> <span className="text-ink-muted">(generated from the full single-shell model with invented parameters, not measured data)</span>
        </details>
        <label className="field">
          <span>Crossover file (.csv)</span>
          <input className="input" type="file" accept=".csv,text/csv,text/plain" onChange={(e) => onFile(e.target.files?.[0])} data-testid="csv-input" />
        </label>
        {fileError && <p className="field-error" role="alert">{fileError}</p>}
        {parsed && (
          <div className="space-y-3" data-testid="csv-report">
            <p className={`text-sm ${parsed.summary.invalidRowCount ? "text-danger" : "text-moss-dark"}`} role="status">“{fileName}”: {parsed.summary.text}</p>
            <p className="text-xs text-ink-muted">Columns read: {parsed.header.columns.map((c) => `${c.header} → ${c.role}`).join("; ")}</p>
            {parsed.errors.length > 0 && (
              <>
                <table data-testid="csv-errors">
                  <thead><tr><th>Row</th><th>Column</th><th>Value</th><th>Problem</th></tr></thead>
                  <tbody>
                    {parsed.errors.map((e, k) => <tr key={k} className="text-danger"><td className="tabular-nums">row {e.rowNumber}</td><td>{e.column ?? "—"}</td><td><code>{e.value ?? ""}</code></td><td>{e.reason}</td></tr>)}
                  </tbody>
                </table>
                {parsed.summary.errorsTruncated && <p className="text-xs">Only the first {parsed.errors.length} problems are listed.</p>}
                <label className="flex items-start gap-2 text-sm">
                  <input type="checkbox" checked={dropBad} onChange={(e) => { setDropBad(e.target.checked); setFit(null); }} className="mt-1" data-testid="drop-bad-rows" />
                  <span>Leave out the {badRows.length} row{badRows.length === 1 ? "" : "s"} with errors ({badRows.join(", ")}) and fit the other {parsed.rows.length}. Otherwise nothing is fitted or saved from this file.</span>
                </label>
              </>
            )}
          </div>
        )}
      </section>

      {parsed && (
        <section className="card space-y-3">
          <h2>2. Fit membrane capacitance and conductance</h2>
          <p className="text-sm text-ink-soft">Model: the full single-shell model — the first crossover is where Re[K] turns from negative to positive — started from the thin-membrane closed form f = √((σm − rG)(2σm + rG)) / (2π r C). Current values of “{p.name}”: C = {formatIn("uF_cm2", p.currentC, 3)}, G = {formatIn("S_m2", p.currentG, 3)}.</p>
          <div className="flex flex-wrap items-end gap-4">
            <label className="field">
              <span>Cell radius for rows without one</span>
              <span className="flex items-center gap-2 font-normal"><input className="input w-28" inputMode="decimal" value={radiusUm} onChange={(e) => setRadiusUm(e.target.value)} aria-label="Cell radius (µm)" /> µm</span>
            </label>
            <label className="flex items-center gap-2 text-sm"><input type="checkbox" checked={fitG} onChange={(e) => setFitG(e.target.checked)} /> Fit the conductance G too (otherwise G = 0)</label>
            <button type="button" className="btn" onClick={runFit} disabled={blocked}>Run the fit</button>
          </div>
          {blocked && <p className="text-sm text-danger">The file has rows with errors: correct it, or tick “leave out” above.</p>}
          {fitError && <p className="field-error" role="alert">{fitError}</p>}
          {fit && (
            <div className="space-y-4" data-testid="fit-result">
              <div className="grid gap-3 sm:grid-cols-3">
                <Estimate label="Membrane capacitance C" unit="uF_cm2" e={fit.capacitance} testId="estimate-c" />
                <Estimate label="Membrane conductance G" unit="S_m2" e={fit.conductance} testId="estimate-g" />
                <div className="rounded-md border border-paper-line bg-paper p-3 text-sm">
                  <p>{fit.pointCount} points, {fit.degreesOfFreedom} degrees of freedom</p>
                  <p>RMS residual {tidy(fit.rmsRelative * 100, 3)} %</p>
                  {fit.rSquared !== null && <p>R² {decimals(fit.rSquared, 4)}</p>}
                  {fit.correlation !== null && <p>Correlation of C and G {decimals(fit.correlation, 2)}</p>}
                  <p className="text-xs text-ink-muted">In SI: C = {tidy(fit.capacitance.estimate, 4)} F/m², G = {tidy(fit.conductance.estimate, 4)} S/m²; radius {tidy(fromSI("um", fit.curve.radius), 3)} µm.</p>
                </div>
              </div>
              {fit.warnings.length > 0 && (
                <ul className="notice list-disc space-y-1 pl-8" data-testid="fit-warnings">
                  {fit.warnings.map((w, k) => <li key={k}>{w.message}</li>)}
                </ul>
              )}
              <div className="grid gap-4 xl:grid-cols-2">
                <FitCurveChart fit={fit} />
                <ResidualsChart fit={fit} />
              </div>
              <p className="text-xs text-ink-muted" data-testid="fit-model">{modelLine(fit)}</p>
            </div>
          )}
        </section>
      )}

      {fit && (
        <section className="card space-y-3">
          <h2>3. Save into the population</h2>
          <p className="text-sm text-ink-soft">Saves version {p.baseVersion + 1} of “{p.name}” with C{fit.conductance.fitted && applyG ? " and G" : ""} set to the estimate{fit.conductance.fitted && applyG ? "s" : ""} (spreads unchanged), provenance “fitted”, the fit and the data file. The server repeats the fit from the file before saving.</p>
          {fit.conductance.fitted && (
            <label className="flex items-start gap-2 text-sm">
              <input type="checkbox" checked={applyG} onChange={(e) => setApplyG(e.target.checked)} className="mt-1" data-testid="apply-g" />
              <span>Also store the fitted conductance G = {formatIn("S_m2", fit.conductance.estimate, 3)} (otherwise G stays {formatIn("S_m2", p.currentG, 3)}).{applyG ? "" : " Unticked because the data do not determine G."}</span>
            </label>
          )}
          <label className="field">
            <span>Change note</span>
            <input className="input" value={note} onChange={(e) => setNote(e.target.value)} placeholder={`Membrane fitted from ${fileName ?? "the file"}`} />
          </label>
          <div className="flex items-center gap-3">
            <button type="button" className="btn" onClick={save} disabled={saving}>Save as version {p.baseVersion + 1}</button>
            {saveMsg && <p className={`text-sm ${saveMsg.ok ? "text-moss-dark" : "text-danger"}`} role="status">{saveMsg.text}</p>}
          </div>
        </section>
      )}
    </div>
  );
}
