import { GEOMETRY_LABELS, type GeometryKind } from "@/lib/library/devices/content";
import type { LibraryKind } from "@/lib/library/kinds";
import { POPULATION_KIND_LABELS, POPULATION_KINDS, type PopulationKind } from "@/lib/library/populations/content";

/** Category filter options and labels of each library (none for buffers). */
export const CATEGORY_OPTIONS: Record<LibraryKind, { value: string; label: string }[]> = {
  populations: POPULATION_KINDS.map((k) => ({ value: k, label: POPULATION_KIND_LABELS[k] })),
  buffers: [],
  devices: (Object.keys(GEOMETRY_LABELS) as GeometryKind[]).map((k) => ({ value: k, label: GEOMETRY_LABELS[k] })),
};

/** Words for a stored category value. @example categoryLabel("populations", "heat-killed") // "Heat-killed" */
export function categoryLabel(kind: LibraryKind, value: string | null): string {
  if (!value) return "—";
  if (kind === "populations") return POPULATION_KIND_LABELS[value as PopulationKind] ?? value;
  if (kind === "devices") return GEOMETRY_LABELS[value as GeometryKind] ?? value;
  return value;
}

/** Pill colours for provenance. */
export const PROVENANCE_PILL: Record<string, string> = {
  measured: "border-moss/40 bg-moss-light text-moss-dark",
  fitted: "border-tide/40 bg-tide-light text-tide",
  assumed: "border-caution/40 bg-caution-light text-caution",
};
