import { canonicalJson } from "./hash";
import type { ProtocolContent } from "./content";
import { describePath, flatten } from "./fields";
import { rankedWindows, type RankedWindow } from "./windows";
import { UnitKind } from "@/lib/units/format";

/** Differences between two protocol contents, for the reviewer's side-by-side view (pure). */

/** One changed leaf: before and after in SI (null when absent on that side). */
export interface FieldChange {
  path: string;
  label: string;
  kind: UnitKind;
  before: unknown;
  after: unknown;
}

/** A ranked window compared across the two versions (matched by rank). */
export interface WindowChange {
  rank: number;
  before: RankedWindow | null;
  after: RankedWindow | null;
  changed: boolean;
}

export interface ContentDiff {
  inputs: FieldChange[];
  selection: FieldChange[];
  warnings: { added: string[]; removed: string[] };
  windows: WindowChange[];
  engineVersion: { before: string; after: string } | null;
}

function changes(before: unknown, after: unknown, prefix: string): FieldChange[] {
  const a = new Map(flatten(before, prefix));
  const b = new Map(flatten(after, prefix));
  const paths = [...new Set([...a.keys(), ...b.keys()])];
  return paths
    .filter((p) => canonicalJson(a.get(p) ?? null) !== canonicalJson(b.get(p) ?? null))
    .map((path) => ({ path, ...describePath(path), before: a.get(path) ?? null, after: b.get(path) ?? null }));
}

/**
 * Compares `after` with `before`: changed inputs (everything but the selection and the plan), changes in the
 * selected operating point and its predictions, added/removed warnings, and the ranked windows side by side.
 * @example diffContents(v1, v2).inputs.map((c) => c.label) // ["Buffer · conductivity tolerance"]
 */
export function diffContents(before: ProtocolContent, after: ProtocolContent): ContentDiff {
  const inputsOf = (c: ProtocolContent) => {
    const { selection: _s, plan: _p, ...rest } = c;
    return rest;
  };
  const selectionOf = (c: ProtocolContent) => {
    const { warnings: _w, ...rest } = c.selection;
    return rest;
  };
  const warn = (c: ProtocolContent) => new Set(c.selection.warnings.map((w) => `${w.severity}: ${w.message}`));
  const wb = warn(before);
  const wa = warn(after);
  const rb = rankedWindows(before.plan.result);
  const ra = rankedWindows(after.plan.result);
  const ranks = [...new Set([...rb.map((w) => w.rank), ...ra.map((w) => w.rank)])].sort((x, y) => x - y);
  return {
    inputs: changes(inputsOf(before), inputsOf(after), ""),
    selection: changes(selectionOf(before), selectionOf(after), "selection"),
    warnings: { added: [...wa].filter((w) => !wb.has(w)), removed: [...wb].filter((w) => !wa.has(w)) },
    windows: ranks.map((rank) => {
      const b = rb.find((w) => w.rank === rank) ?? null;
      const a = ra.find((w) => w.rank === rank) ?? null;
      return { rank, before: b, after: a, changed: canonicalJson(b) !== canonicalJson(a) };
    }),
    engineVersion: before.plan.engineVersion === after.plan.engineVersion ? null : { before: before.plan.engineVersion, after: after.plan.engineVersion },
  };
}
