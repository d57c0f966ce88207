"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { compileParticle, effectivePermittivityInto, imagCM, isomotiveField, realCM, rotationChamberField, EPSILON_0, type Particle } from "@/lib/dielectric";
import { parseCellsCsv, PARAMETER_INFO, summarisePopulation, type CellsCsvResult, type FitParameterName, type PopulationFit, type SpectrumKind } from "@/lib/fitting";
import { saveCharacterisationAction } from "@/lib/characterisation/actions";
import type { DeviceSetup } from "@/lib/characterisation/schema";
import { InputError } from "@/lib/errors";
import { formatIn, toSI, type UnitId } from "@/lib/units/lab";
import { CellSpectraChart, ParameterHistogram, PopulationBandChart } from "./charts";
import { CellTable, SpreadCards } from "./tables";

export interface LibraryDeviceOption {
  id: number;
  name: string;
  gamma: number;
  source: string;
}

interface Props {
  id: number;
  baseVersion: number;
  name: string;
  particle: Particle;
  devices: LibraryDeviceOption[];
  examples: Record<SpectrumKind, string>;
  defaults: { conductivity: number; permittivity: number; viscosity: number; vertexDistance: number; voltageRms: number; tipDistance: number; electrodeVoltage: number };
}

/** Lab unit of each fitted quantity on screen. */
export const PARAM_UNIT: Record<FitParameterName | "radius", UnitId> = { membraneCapacitance: "uF_cm2", membraneConductance: "S_m2", cytoplasmConductivity: "S_m", cytoplasmPermittivity: "rel", radius: "um" };

const KIND_LABEL: Record<SpectrumKind, { label: string; unit: UnitId; axis: string }> = {
  "dep-velocity": { label: "DEP velocity", unit: "um_s", axis: "DEP velocity (µm/s, + towards stronger field)" },
  "rotation-rate": { label: "rotation rate", unit: "rad_s", axis: "Rotation rate (rad/s, + with the field)" },
  "re-k": { label: "Re[K]", unit: "rel", axis: "Re[K]" },
  "im-k": { label: "Im[K]", unit: "rel", axis: "Im[K]" },
  "relative-re-k": { label: "relative Re[K]", unit: "rel", axis: "Relative Re[K] (file units)" },
};

type Source = DeviceSetup["source"];
const num = (s: string) => Number(s.replace(",", "."));

function percentile(sorted: number[], q: number): number {
  const i = (sorted.length - 1) * q;
  const lo = Math.floor(i);
  return sorted[lo] + (sorted[Math.min(sorted.length - 1, lo + 1)] - sorted[lo]) * (i - lo);
}

/** Upload single-cell spectra, fit every cell on the server, inspect, and save the spreads as a new population version. */
export function CharacteriseWorkbench(p: Props) {
  const router = useRouter();
  const [fileName, setFileName] = useState<string | null>(null);
  const [text, setText] = useState("");
  const [parsed, setParsed] = useState<CellsCsvResult | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [sigma, setSigma] = useState(String(p.defaults.conductivity * 1e3));
  const [epsM, setEpsM] = useState(String(p.defaults.permittivity));
  const [eta, setEta] = useState(String(p.defaults.viscosity * 1e3));
  const [source, setSource] = useState<Source>("isomotive");
  const [vertexUm, setVertexUm] = useState(String(p.defaults.vertexDistance * 1e6));
  const [volts, setVolts] = useState(String(p.defaults.voltageRms));
  const [deviceId, setDeviceId] = useState(p.devices[0] ? String(p.devices[0].id) : "");
  const [gammaText, setGammaText] = useState("1e12");
  const [tipUm, setTipUm] = useState(String(p.defaults.tipDistance * 1e6));
  const [electrodeV, setElectrodeV] = useState(String(p.defaults.electrodeVoltage));
  const [e0Text, setE0Text] = useState("3");
  const [fitNames, setFitNames] = useState<FitParameterName[]>(["membraneCapacitance", "cytoplasmConductivity"]);
  const [progress, setProgress] = useState<{ done: number; total: number } | null>(null);
  const [result, setResult] = useState<PopulationFit | null>(null);
  const [fitSetup, setFitSetup] = useState<{ device: DeviceSetup; fit: FitParameterName[]; medium: { conductivity: number; permittivity: number; viscosity: number } } | null>(null);
  const [fitError, setFitError] = useState<string | null>(null);
  const [exclude, setExclude] = useState<string[]>([]);
  const [include, setInclude] = useState<string[]>([]);
  const [selected, setSelected] = useState("");
  const [note, setNote] = useState("");
  const [saveMsg, setSaveMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const [saving, setSaving] = useState(false);
  const kind = parsed?.kind ?? "dep-velocity";

  function load(name: string, t: string) {
    setResult(null); setFitError(null); setSaveMsg(null); setFileError(null); setExclude([]); setInclude([]);
    setFileName(name);
    setText(t);
    try {
      const r = parseCellsCsv(t);
      setParsed(r);
      setSource(r.kind === "rotation-rate" ? "rotation-chamber" : r.kind === "dep-velocity" ? "isomotive" : "none");
      setSelected(r.cells[0]?.id ?? "");
    } catch (err) {
      setParsed(null);
      setFileError(err instanceof InputError ? err.issues.map((i) => i.message).join(" ") : err instanceof Error ? err.message : String(err));
    }
  }

  /** The device choice as sent to the server, or a message naming what is wrong. */
  function deviceSetup(): DeviceSetup | string {
    const v = num(volts);
    const volt = Number.isFinite(v) && v > 0 && v <= 1000 ? v : null;
    switch (source) {
      case "isomotive": {
        const r = num(vertexUm);
        if (!(r >= 1 && r <= 1e5)) return "Distance from the vertex: enter 1 to 100 000 µm.";
        return volt === null ? "Voltage: enter 0.001 to 1000 V rms." : { source, vertexDistance: toSI("um", r), voltageRms: volt };
      }
      case "library":
        if (!deviceId) return "Device: choose a device from the library.";
        return volt === null ? "Voltage: enter 0.001 to 1000 V rms." : { source, deviceId: Number(deviceId), voltageRms: volt };
      case "gamma": {
        const g = num(gammaText);
        if (!(g >= 1 && g <= 1e25)) return "Γ: enter a number from 1 to 1e25 m⁻³.";
        return volt === null ? "Voltage: enter 0.001 to 1000 V rms." : { source, gamma: g, voltageRms: volt };
      }
      case "rotation-chamber": {
        const d = num(tipUm);
        const u = num(electrodeV);
        if (!(d >= 1 && d <= 1e5)) return "Tip-to-tip distance: enter 1 to 100 000 µm.";
        if (!(u > 0 && u <= 1000)) return "Electrode voltage: enter 0.001 to 1000 V.";
        return { source, tipDistance: toSI("um", d), electrodeVoltage: u };
      }
      case "field": {
        const e = num(e0Text);
        if (!(e > 0 && e <= 1e5)) return "E0: enter 0.001 to 100 000 kV/m.";
        return { source, rotatingFieldAmplitude: toSI("kV_m", e) };
      }
      default:
        return { source: "none" };
    }
  }

  function fieldOf(d: DeviceSetup) {
    if (d.source === "isomotive") return { gamma: isomotiveField(d.vertexDistance).gamma, voltageRms: d.voltageRms };
    if (d.source === "library") return { gamma: p.devices.find((x) => x.id === d.deviceId)!.gamma, voltageRms: d.voltageRms };
    if (d.source === "gamma") return { gamma: d.gamma, voltageRms: d.voltageRms };
    if (d.source === "rotation-chamber") return { rotatingFieldAmplitude: rotationChamberField(d.tipDistance, d.fieldPerVolt).fieldPerVolt * d.electrodeVoltage };
    if (d.source === "field") return { rotatingFieldAmplitude: d.rotatingFieldAmplitude };
    return undefined;
  }

  const medium = { conductivity: toSI("mS_m", num(sigma)), permittivity: num(epsM), viscosity: toSI("mPa_s", num(eta)) };
  const mediumError =
    !(num(sigma) >= 0.001 && num(sigma) <= 20000) ? "Medium conductivity: enter 0.001 to 20 000 mS/m." :
    !(num(epsM) >= 1 && num(epsM) <= 200) ? "Medium relative permittivity: enter 1 to 200." :
    !(num(eta) >= 0.1 && num(eta) <= 1000) ? "Viscosity: enter 0.1 to 1000 mPa·s." : null;

  async function runFit() {
    if (!parsed) return;
    setResult(null); setFitError(null); setSaveMsg(null);
    const d = deviceSetup();
    if (typeof d === "string" || mediumError) return setFitError(typeof d === "string" ? d : mediumError);
    const body = { kind: parsed.kind, medium, field: fieldOf(d), particle: p.particle, fit: fitNames, cells: parsed.cells };
    setProgress({ done: 0, total: parsed.cells.length });
    try {
      const res = await fetch("/api/v1/fits/cells", { method: "POST", headers: { "content-type": "application/json", accept: "application/x-ndjson" }, body: JSON.stringify(body) });
      if (!res.ok || !res.body) {
        const e = await res.json().catch(() => ({}));
        setFitError(e.issues?.map((i: { message: string }) => i.message).join(" ") || e.message || `The fit was refused (HTTP ${res.status}).`);
        return;
      }
      const reader = res.body.pipeThrough(new TextDecoderStream()).getReader();
      let buf = "";
      for (;;) {
        const { value, done } = await reader.read();
        if (done) break;
        buf += value;
        let nl;
        while ((nl = buf.indexOf("\n")) >= 0) {
          const line = JSON.parse(buf.slice(0, nl));
          buf = buf.slice(nl + 1);
          if (line.type === "progress") setProgress({ done: line.done, total: line.total });
          if (line.type === "error") setFitError(line.message);
          if (line.type === "result") {
            setResult(line.result);
            setFitSetup({ device: d, fit: fitNames, medium });
            setExclude([]);
            setInclude([]);
          }
        }
      }
    } catch {
      setFitError("The connection to the server was lost during the fit; nothing was saved. Try again.");
    } finally {
      setProgress(null);
    }
  }

  const view = useMemo(() => (result && fitSetup ? { ...result, ...summarisePopulation(result.cells, fitSetup.fit, { exclude, include }) } : null), [result, fitSetup, exclude, include]);

  const band = useMemo(() => {
    if (!view || !parsed || !fitSetup) return null;
    const m = fitSetup.medium;
    const fits = view.cells.filter((c) => c.included && c.fit).map((c) => compileParticle(c.fit!.particle as Particle));
    if (fits.length < 2) return null;
    const fs = parsed.cells.flatMap((c) => c.points.map((q) => q.frequency));
    const lo = Math.min(...fs) / 2;
    const hi = Math.max(...fs) * 2;
    const imag = kind === "rotation-rate" || kind === "im-k";
    const o = new Float64Array(2);
    return Array.from({ length: 60 }, (_, i) => {
      const f = lo * (hi / lo) ** (i / 59);
      const w = 2 * Math.PI * f;
      const mi = -m.conductivity / (EPSILON_0 * w);
      const ks = fits.map((cp) => {
        effectivePermittivityInto(cp, w, o);
        return imag ? imagCM(o[0], o[1], m.permittivity, mi) : realCM(o[0], o[1], m.permittivity, mi);
      }).sort((a, b) => a - b);
      return { frequency: f, low: percentile(ks, 0.05), median: percentile(ks, 0.5), high: percentile(ks, 0.95) };
    });
  }, [view, parsed, kind, fitSetup]);

  async function save() {
    if (!parsed || !fitSetup || !fileName) return;
    setSaving(true);
    setSaveMsg(null);
    try {
      const r = await saveCharacterisationAction(p.id, { baseVersion: p.baseVersion, fileName, csvText: text, medium: fitSetup.medium, device: fitSetup.device, fit: fitSetup.fit, exclude, include, changeNote: note || undefined });
      setSaveMsg({ ok: r.ok, text: r.message ?? (r.ok ? "Saved." : "Not saved.") });
      if (r.ok) {
        router.push(`/library/populations/${p.id}`);
        router.refresh();
      }
    } finally {
      setSaving(false);
    }
  }

  const toggle = (id: string, on: boolean) => {
    setExclude((x) => (on ? x.filter((v) => v !== id) : [...x.filter((v) => v !== id), id]));
    setInclude((x) => (on ? [...x.filter((v) => v !== id), id] : x.filter((v) => v !== id)));
  };
  const k = KIND_LABEL[kind];
  const needsVolts = source === "isomotive" || source === "library" || source === "gamma";

  return (
    <div className="space-y-5">
      <section className="card space-y-3">
        <h2>1. Upload single-cell measurements</h2>
        <p className="text-sm text-ink-soft">
          One row per cell and frequency: <code>cell</code>, <code>frequency (kHz)</code> (or Hz, MHz), one measured-value column and <code>radius (µm)</code> (or diameter; on at least one row of each cell).
          The value column says what was measured: <code>DEP velocity (µm/s)</code> (or mm/s, m/s; positive = towards stronger field), <code>rotation rate (rad/s)</code> (or rpm; positive = with the field),
          <code> Re[K]</code>, <code>Im[K]</code>, or <code>relative Re[K] (your unit)</code> (a scale is fitted per cell). Comma, semicolon or tab separated; decimal points; up to 10 MiB.
        </p>
        <details className="text-sm">
          <summary className="cursor-pointer font-medium">Example files (invented Quarry Hill live cells, generated by the engine)</summary>
          <ul className="mt-2 list-disc pl-6">
            {(Object.keys(p.examples) as SpectrumKind[]).map((x) => (
              <li key={x}>
                {KIND_LABEL[x].label}:{" "}
                <a href={`data:text/csv;charset=utf-8,${encodeURIComponent(p.examples[x])}`} download={`cells-${x}-example.csv`}>download</a>{" "}
                or <button type="button" className="btn-quiet" data-testid={`use-example-${x}`} onClick={() => load(`cells-${x}-example.csv`, p.examples[x])}>use it here</button>
              </li>
            ))}
          </ul>
          <p className="mt-1 text-xs text-ink-muted">Made with: medium {formatIn("mS_m", p.defaults.conductivity, 3)}, εr {formatIn("rel", p.defaults.permittivity, 3)}, {formatIn("mPa_s", p.defaults.viscosity, 3)}; isomotive electrodes {formatIn("um", p.defaults.vertexDistance, 3)} from the vertex at {formatIn("V", p.defaults.voltageRms, 3)} rms; rotation chamber {formatIn("um", p.defaults.tipDistance, 3)} tip to tip at {formatIn("V", p.defaults.electrodeVoltage, 3)} per electrode. Not measured data.</p>
        </details>
        <label className="field">
          <span>Cell spectra file (.csv)</span>
          <input className="input" type="file" accept=".csv,text/csv,text/plain" data-testid="cells-csv-input" onChange={async (e) => { const f = e.target.files?.[0]; if (f) load(f.name, await f.text()); }} />
        </label>
        {fileError && <p className="field-error" role="alert">{fileError}</p>}
        {parsed && (
          <div className="space-y-2" data-testid="cells-csv-report">
            <p className={`text-sm ${parsed.errors.length ? "text-danger" : "text-moss-dark"}`} role="status">“{fileName}”: {parsed.summary} Measured: {parsed.valueColumn}.</p>
            {parsed.errors.length > 0 && (
              <table data-testid="cells-csv-errors">
                <thead><tr><th>Row</th><th>Column</th><th>Problem (row left out)</th></tr></thead>
                <tbody>{parsed.errors.slice(0, 100).map((e, i) => <tr key={i} className="text-danger"><td>row {e.rowNumber}</td><td>{e.column ?? "—"}</td><td>{e.reason}</td></tr>)}</tbody>
              </table>
            )}
          </div>
        )}
      </section>

      {parsed && parsed.cells.length > 0 && (
        <section className="card space-y-3">
          <h2>2. Medium, field and parameters</h2>
          <div className="flex flex-wrap items-end gap-4">
            <label className="field"><span>Medium conductivity (mS/m)</span><input className="input w-28" inputMode="decimal" value={sigma} onChange={(e) => setSigma(e.target.value)} /></label>
            <label className="field"><span>Medium relative permittivity</span><input className="input w-28" inputMode="decimal" value={epsM} onChange={(e) => setEpsM(e.target.value)} /></label>
            <label className="field"><span>Viscosity (mPa·s)</span><input className="input w-28" inputMode="decimal" value={eta} onChange={(e) => setEta(e.target.value)} /></label>
          </div>
          {(kind === "dep-velocity" || kind === "rotation-rate") && (
            <div className="flex flex-wrap items-end gap-4">
              <label className="field">
                <span>Field from</span>
                <select className="input" value={source} onChange={(e) => setSource(e.target.value as Source)} data-testid="field-source">
                  {kind === "dep-velocity" ? (
                    <>
                      <option value="isomotive">Constant-gradient (isomotive) electrodes</option>
                      <option value="library" disabled={p.devices.length === 0}>A device in the library</option>
                      <option value="gamma">Γ I enter</option>
                    </>
                  ) : (
                    <>
                      <option value="rotation-chamber">Four-electrode chamber (E0 ≈ 2V/d)</option>
                      <option value="field">E0 I enter</option>
                    </>
                  )}
                </select>
              </label>
              {source === "isomotive" && <label className="field"><span>Vertex to driven electrode (µm)</span><input className="input w-28" inputMode="decimal" value={vertexUm} onChange={(e) => setVertexUm(e.target.value)} /></label>}
              {source === "library" && (
                <label className="field"><span>Device</span>
                  <select className="input" value={deviceId} onChange={(e) => setDeviceId(e.target.value)}>
                    {p.devices.map((d) => <option key={d.id} value={d.id}>{d.name} (Γ {formatIn("per_m3", d.gamma, 3)})</option>)}
                  </select>
                </label>
              )}
              {source === "gamma" && <label className="field"><span>Γ (m⁻³)</span><input className="input w-32" inputMode="decimal" value={gammaText} onChange={(e) => setGammaText(e.target.value)} /></label>}
              {needsVolts && <label className="field"><span>Voltage (V rms)</span><input className="input w-24" inputMode="decimal" value={volts} onChange={(e) => setVolts(e.target.value)} /></label>}
              {source === "rotation-chamber" && (
                <>
                  <label className="field"><span>Tip-to-tip distance (µm)</span><input className="input w-28" inputMode="decimal" value={tipUm} onChange={(e) => setTipUm(e.target.value)} /></label>
                  <label className="field"><span>Voltage per electrode (V)</span><input className="input w-24" inputMode="decimal" value={electrodeV} onChange={(e) => setElectrodeV(e.target.value)} /></label>
                </>
              )}
              {source === "field" && <label className="field"><span>E0 (kV/m)</span><input className="input w-28" inputMode="decimal" value={e0Text} onChange={(e) => setE0Text(e.target.value)} /></label>}
            </div>
          )}
          <fieldset className="flex flex-wrap gap-4 text-sm">
            <legend className="font-medium">Fit per cell (the rest stay at “{p.name}”&apos;s values)</legend>
            {(Object.keys(PARAMETER_INFO) as FitParameterName[]).map((n) => (
              <label key={n} className="flex items-center gap-2">
                <input type="checkbox" checked={fitNames.includes(n)} onChange={(e) => setFitNames((f) => (e.target.checked ? [...f, n] : f.filter((x) => x !== n)))} />
                {PARAMETER_INFO[n].label}
              </label>
            ))}
          </fieldset>
          <p className="text-xs text-ink-muted">Conversions: v = ε0 εm r² Re[K] Γ V² / (3η); Ω = −ε0 εm Im[K] E0² / (2η) (Stokes drag; wall effects and inertia neglected). Membrane conductance shows only at low frequency in a low-conductivity medium; fit it only when the data reach there. Cytoplasm permittivity needs frequencies past about 10 MHz.</p>
          <button type="button" className="btn" onClick={runFit} disabled={progress !== null || fitNames.length === 0}>Fit {parsed.cells.length} cells</button>
          {progress && (
            <div role="status" data-testid="fit-progress" className="text-sm">
              <progress max={progress.total} value={progress.done} className="w-64 align-middle" /> fitted {progress.done} of {progress.total} cells
            </div>
          )}
          {fitError && <p className="field-error" role="alert">{fitError}</p>}
        </section>
      )}

      {view && parsed && (
        <section className="card space-y-4" data-testid="characterisation-result">
          <h2>3. Results</h2>
          <p className="text-sm text-ink-soft">{view.includedCount} of {view.cells.length} cells included. {view.intervalNote} Predictions from a model: check them against your own bench observations.</p>
          <SpreadCards spreads={view.spreads} units={PARAM_UNIT} />
          <div className="grid gap-4 xl:grid-cols-2">
            <div className="space-y-2">
              <label className="field"><span>Cell shown</span>
                <select className="input" value={selected} onChange={(e) => setSelected(e.target.value)} data-testid="cell-select">
                  {view.cells.map((c) => <option key={c.id} value={c.id}>{c.id}{c.included ? "" : " (left out)"}</option>)}
                </select>
              </label>
              <CellSpectraChart
                cells={view.cells.map((c) => ({ id: c.id, included: c.included, curve: c.fit?.curve ?? [], points: parsed.cells.find((x) => x.id === c.id)?.points ?? [] }))}
                selected={selected}
                valueLabel={k.axis}
                valueUnit={k.unit}
              />
            </div>
            {band && <PopulationBandChart band={band} label={kind === "rotation-rate" || kind === "im-k" ? "Im[K]" : "Re[K]"} />}
          </div>
          <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-4" data-testid="histograms">
            {view.spreads.map((s) => (
              <ParameterHistogram key={s.name} testId={`histogram-${s.name}`} title={`${s.name === "radius" ? "radius" : PARAMETER_INFO[s.name].label} (n = ${s.n})`} unit={PARAM_UNIT[s.name]} values={view.cells.filter((c) => c.included && c.fit).map((c) => (s.name === "radius" ? c.radius : c.fit!.parameters.find((q) => q.name === s.name)!.estimate))} />
            ))}
          </div>
          <CellTable cells={view.cells} fit={fitSetup!.fit} units={PARAM_UNIT} onToggle={toggle} />
        </section>
      )}

      {view && (
        <section className="card space-y-3">
          <h2>4. Save as a new version of “{p.name}”</h2>
          <p className="text-sm text-ink-soft">Saves version {p.baseVersion + 1} with each fitted parameter and the radius set to the included cells&apos; mean, CV and distribution (the other parameters unchanged), provenance “fitted”, the data file and the fit report. The server repeats every fit from the file before saving.</p>
          <label className="field"><span>Change note (optional)</span><input className="input" value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} /></label>
          <button type="button" className="btn" onClick={save} disabled={saving || view.includedCount < 2} data-testid="save-characterisation">{saving ? "Saving… (fitting again on the server)" : "Save as a new version"}</button>
          {view.includedCount < 2 && <p className="text-sm text-danger">Include at least 2 cells to save a spread.</p>}
          {saveMsg && <p className={`text-sm ${saveMsg.ok ? "text-moss-dark" : "text-danger"}`} role="status">{saveMsg.text}</p>}
        </section>
      )}
    </div>
  );
}
