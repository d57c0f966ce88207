/**
 * Sort designs: which population must move which way, and how recovery and purity follow from the fractions.
 */

/** How the two populations are separated. */
export type SortDesign =
  | { kind: "capture"; captured?: "target" | "other" }
  | { kind: "opposite-deflection" }
  | { kind: "magnitude-deflection" };

/**
 * Plain-language description of each design and the assumptions its numbers rest on.
 * @example describeDesign({ kind: "capture" }) // → "Capture: the target population is held on the electrodes …"
 */
export function describeDesign(d: SortDesign): string {
  switch (d.kind) {
    case "capture":
      return (d.captured ?? "target") === "target"
        ? "Capture: the target population is held on the electrodes by positive DEP while the other passes with the flow, then released and collected. Recovery = target cells with Re[K] above +margin that reach the target DEP speed. Contamination = other cells with Re[K] above +margin, counted whatever their speed (worst case)."
        : "Depletion by capture: the other population is held on the electrodes by positive DEP and the target is collected in the flow-through. Recovery = target cells not above +margin (any above it are counted as lost, worst case). Contamination = other cells that are not both above +margin and at the target DEP speed.";
    case "opposite-deflection":
      return "Opposite-direction deflection: in the flow, the target is pushed one way (positive or negative DEP, whichever its mean cell feels at the point) and the other population the opposite way. Recovery = target cells beyond the margin in their direction that reach the target DEP speed. Contamination = other cells that do not reach the opposite outlet, i.e. are not beyond the margin the other way at the target DEP speed (undecided cells are counted as contaminants, worst case).";
    case "magnitude-deflection":
      return "Same-direction deflection by magnitude: both populations feel DEP the same way; the target, deflected more strongly, reaches its outlet. Recovery = target cells beyond the margin that reach the target DEP speed. Contamination = other cells moving at least half as fast as the slow target cells (r²·Re[K] at least half the target's slow-cell value), whatever the voltage.";
  }
}

/**
 * Purity of the collected fraction from recovery R, contamination C (share of the other population collected)
 * and the target's share x of the input: xR / (xR + (1 − x)C); 0 when nothing is collected.
 * @example purity(0.9, 0.05, 0.5) // → 0.947
 */
export function purity(recovery: number, contamination: number, targetFraction: number): number {
  const t = targetFraction * recovery;
  const o = (1 - targetFraction) * contamination;
  return t + o > 0 ? t / (t + o) : 0;
}
