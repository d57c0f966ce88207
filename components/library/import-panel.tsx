"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import type { LibraryKind } from "@/lib/library/kinds";
import type { ImportReport } from "@/lib/library/transfer";

/** Uploads a library JSON file and shows what was imported and what was refused, item by item. */
export function ImportPanel({ kind, label }: { kind: LibraryKind; label: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [report, setReport] = useState<ImportReport | null>(null);

  async function onFile(file: File | undefined) {
    if (!file) return;
    setBusy(true);
    setError(null);
    setReport(null);
    try {
      const text = await file.text();
      try {
        JSON.parse(text);
      } catch {
        setError(`"${file.name}" is not JSON. Choose a file exported from a Sievewright library.`);
        return;
      }
      const res = await fetch(`/api/v1/library/${kind}/import`, { method: "POST", headers: { "content-type": "application/json" }, body: text });
      const body = await res.json();
      if (!res.ok) {
        setError([body.message, ...(body.issues ?? []).slice(1, 6).map((i: { message: string }) => i.message)].join(" "));
        return;
      }
      setReport(body as ImportReport);
      router.refresh();
    } finally {
      setBusy(false);
    }
  }

  return (
    <details className="card" data-testid="import-panel">
      <summary className="cursor-pointer font-medium">Import {label.toLowerCase()} from a file</summary>
      <div className="mt-3 space-y-3 text-sm">
        <p className="text-ink-soft">
          Choose a JSON file exported from this library. Each item is checked with the same rules as the forms; an item with any problem is refused as a whole and nothing of it is saved.
          Items whose name already exists here are refused too.
        </p>
        <label className="field">
          <span>Library file (.json)</span>
          <input className="input" type="file" accept="application/json,.json" disabled={busy} onChange={(e) => onFile(e.target.files?.[0])} />
        </label>
        {busy && <p role="status">Importing…</p>}
        {error && <p className="field-error" role="alert">{error}</p>}
        {report && (
          <div role="status" data-testid="import-report" className="space-y-2">
            <p><strong>{report.imported.length}</strong> imported, <strong>{report.refused.length}</strong> refused.</p>
            {report.imported.length > 0 && (
              <ul className="list-disc pl-5">
                {report.imported.map((r) => <li key={r.index}>Item {r.index}: “{r.name}” with {r.versions} version{r.versions === 1 ? "" : "s"}</li>)}
              </ul>
            )}
            {report.refused.length > 0 && (
              <ul className="list-disc pl-5 text-danger">
                {report.refused.map((r) => <li key={r.index}>Item {r.index}: “{r.name}” — {r.reasons.join("; ")}</li>)}
              </ul>
            )}
          </div>
        )}
      </div>
    </details>
  );
}
