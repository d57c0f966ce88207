import { PROVENANCE_LABELS } from "./schemas";
import { kindInfo, type ContentOf, type LibraryKind } from "./kinds";
import type { ItemVersion } from "./mapper";

/** One line of a version comparison, in lab units. */
export interface DiffRow {
  key: string;
  label: string;
  before: string;
  after: string;
  changed: boolean;
}

function provenanceText(v: ItemVersion): string {
  return `${PROVENANCE_LABELS[v.provenance.kind]}${v.provenance.source ? `: ${v.provenance.source}` : ""}`;
}

/**
 * Compares two versions line by line in lab units (the same lines the detail page shows), provenance included.
 * Lines present in only one version show "—" on the other side.
 * @example diffVersions("populations", v1, v2).filter((r) => r.changed) // [{ label: "Membrane capacitance", before: "1 µF/cm² …", after: "0.92 µF/cm² …" }]
 */
export function diffVersions<K extends LibraryKind>(kind: K, before: ItemVersion<ContentOf[K]>, after: ItemVersion<ContentOf[K]>): DiffRow[] {
  const describe = kindInfo(kind).describe;
  const a = describe(before.content);
  const b = describe(after.content);
  const keys = [...a.map((r) => r.key), ...b.map((r) => r.key).filter((k) => !a.some((r) => r.key === k))];
  const rows = keys.map((key) => {
    const x = a.find((r) => r.key === key);
    const y = b.find((r) => r.key === key);
    const bv = x?.value ?? "—";
    const av = y?.value ?? "—";
    return { key, label: (y ?? x)!.label, before: bv, after: av, changed: bv !== av };
  });
  const pb = provenanceText(before);
  const pa = provenanceText(after);
  rows.push({ key: "provenance", label: "Provenance", before: pb, after: pa, changed: pb !== pa });
  return rows;
}
