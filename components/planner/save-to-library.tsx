"use client";

import Link from "next/link";
import { useId, useState } from "react";
import { saveLibraryItemAction } from "@/lib/library/actions";
import { POPULATION_KIND_LABELS, POPULATION_KINDS, type PopulationKind } from "@/lib/library/populations/content";
import { PROVENANCE_LABELS } from "@/lib/library/schemas";
import type { PopulationFormValues } from "@/lib/wizard/population-form";

/** The panel's own fields; any other field message (a model parameter) is listed under the panel. */
const OWN_FIELDS = ["name", "kind", "organisation", "provenanceKind", "provenanceSource", "changeNote"] as const;
type OwnField = (typeof OWN_FIELDS)[number];

/**
 * "Save this population to the library" from the planner: the population as it stands in the step (name and shell
 * model in lab units) plus what the library asks of every item (kind, provenance, a change note), sent through the
 * library's own save action (same form schema, same role rule `library.edit`, same audit trail). On success the step's
 * population points at the new library item (`onSaved`); on failure each message is shown by its field and nothing
 * is saved. `allowed` is false for roles that may not write the library: the panel then says so instead.
 */
export function SaveToLibrary({ which, values, allowed, onSaved }: {
  which: "target" | "other";
  values: PopulationFormValues;
  allowed: boolean;
  onSaved: (ref: { id: number; version: number }) => void;
}) {
  const uid = useId();
  const [open, setOpen] = useState(false);
  const [kind, setKind] = useState<PopulationKind>(which === "target" ? "live" : "dead");
  const [organisation, setOrganisation] = useState("");
  const [provenanceKind, setProvenanceKind] = useState<"measured" | "assumed">("assumed");
  const [provenanceSource, setProvenanceSource] = useState("");
  const [changeNote, setChangeNote] = useState("Defined in the planner");
  const [busy, setBusy] = useState(false);
  const [status, setStatus] = useState<{ ok: boolean; text: string; id?: number } | null>(null);
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});

  if (!allowed) return <p className="hint" data-testid={`save-to-library-${which}`}>Only assay developers add populations to the library; ask one to save this population if you want to reuse it.</p>;

  async function save() {
    setBusy(true);
    setStatus(null);
    setFieldErrors({});
    const model: Partial<PopulationFormValues> = { ...values };
    delete model.libraryRef;
    const result = await saveLibraryItemAction("populations", null, {
      ...model,
      kind,
      organisation,
      description: "Saved from the planner.",
      provenanceKind,
      provenanceSource,
      changeNote,
      mode: "new-version",
    });
    setBusy(false);
    if (result.ok && result.data) {
      setStatus({ ok: true, text: `Saved "${values.name}" to the population library (item ${result.data.id}, version ${result.data.version}). This step now uses it.`, id: result.data.id });
      onSaved({ id: result.data.id, version: result.data.version });
      return;
    }
    if (!result.ok) {
      const fields = result.fieldErrors ?? {};
      setFieldErrors(fields);
      const n = Object.keys(fields).length;
      setStatus({ ok: false, text: n > 0 ? `Not saved to the library: ${n === 1 ? "one field needs" : `${n} fields need`} attention (each message names the field and what is allowed).` : `Not saved to the library: ${result.message}` });
    }
  }

  const own = (f: OwnField) => fieldErrors[f] && <p className="field-error">{fieldErrors[f]}</p>;
  const others = Object.entries(fieldErrors).filter(([k]) => !(OWN_FIELDS as readonly string[]).includes(k));
  const fid = (f: string) => `${uid}-${f}`;

  return (
    <div className="rounded-md border border-paper-line bg-paper/60 p-3 text-sm" data-testid={`save-to-library-${which}`}>
      {!open ? (
        <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => setOpen(true)}>Save this population to the library…</button>
      ) : (
        <div className="space-y-3">
          <p className="font-medium">Save &ldquo;{values.name}&rdquo; to the population library</p>
          {own("name")}
          <div className="grid gap-3 sm:grid-cols-2">
            <div className="field">
              <label htmlFor={fid("kind")}>Kind</label>
              <select id={fid("kind")} className="input" value={kind} onChange={(e) => setKind(e.target.value as PopulationKind)}>
                {POPULATION_KINDS.map((k) => <option key={k} value={k}>{POPULATION_KIND_LABELS[k]}</option>)}
              </select>
              {own("kind")}
            </div>
            <div className="field">
              <label htmlFor={fid("organisation")}>Organisation or project (optional)</label>
              <input id={fid("organisation")} className="input" value={organisation} onChange={(e) => setOrganisation(e.target.value)} />
              {own("organisation")}
            </div>
            <div className="field">
              <label htmlFor={fid("provenance")}>Where the values come from</label>
              <select id={fid("provenance")} className="input" value={provenanceKind} onChange={(e) => setProvenanceKind(e.target.value as "measured" | "assumed")}>
                <option value="assumed">{PROVENANCE_LABELS.assumed}</option>
                <option value="measured">{PROVENANCE_LABELS.measured}</option>
              </select>
              {own("provenanceKind")}
            </div>
            <div className="field">
              <label htmlFor={fid("source")}>Source (optional)</label>
              <input id={fid("source")} className="input" value={provenanceSource} placeholder="e.g. our crossover data of 2026-11, or a reference" onChange={(e) => setProvenanceSource(e.target.value)} />
              {own("provenanceSource")}
            </div>
            <div className="field sm:col-span-2">
              <label htmlFor={fid("note")}>Change note</label>
              <input id={fid("note")} className="input" value={changeNote} onChange={(e) => setChangeNote(e.target.value)} />
              {own("changeNote")}
            </div>
          </div>
          {others.length > 0 && (
            <ul className="list-disc pl-5 text-danger" data-testid={`save-to-library-${which}-issues`}>
              {others.map(([k, m]) => <li key={k}>{m}</li>)}
            </ul>
          )}
          <div className="flex flex-wrap items-center gap-2">
            <button type="button" className="btn px-3 py-1 text-sm" disabled={busy} onClick={save}>{busy ? "Saving…" : "Save to the library"}</button>
            <button type="button" className="btn-quiet px-2 py-1 text-xs" disabled={busy} onClick={() => { setOpen(false); setStatus(null); setFieldErrors({}); }}>Close</button>
          </div>
        </div>
      )}
      {status && (
        <p className={`mt-2 ${status.ok ? "text-moss-dark" : "text-danger"}`} role="status" data-testid={`save-to-library-${which}-status`}>
          {status.text}
          {status.id !== undefined && <> <Link href={`/library/populations/${status.id}`}>Open it in the library</Link></>}
        </p>
      )}
    </div>
  );
}
