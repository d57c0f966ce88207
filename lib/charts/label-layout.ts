/**
 * Placing text labels on a chart so that none overlaps another or runs off the plot: each label wants to sit
 * centred on an anchor x (pixels); it is shifted sideways to stay inside [left, right], and put on the first of a
 * few stacked lines where it overlaps nothing already placed. Labels that fit on no line are reported as hidden, so
 * the chart can list them elsewhere (a legend or a table) instead of drawing them on top of each other.
 */

/** A label to place: anchor x in pixels and its width in pixels. */
export interface LabelRequest {
  x: number;
  width: number;
}

/** Where a label goes: its left edge x, the line it sits on (0 = nearest the anchor), or hidden. */
export interface LabelPlacement {
  left: number;
  line: number;
  hidden: boolean;
}

/**
 * Width of a text in pixels at a font size, from an average glyph width (about 0.6 em for a sans-serif face).
 * @example textWidth("O1 46.8 kHz", 10) // → 66
 */
export function textWidth(text: string, fontSize: number): number {
  return Math.ceil(text.length * fontSize * 0.6);
}

/**
 * Places labels left to right on up to `lines` stacked lines with at least `gap` pixels between neighbours.
 * @example layoutLabels([{ x: 100, width: 60 }, { x: 110, width: 60 }], { left: 0, right: 400, lines: 2 })
 * // → [{ left: 70, line: 0, hidden: false }, { left: 80, line: 1, hidden: false }]
 */
export function layoutLabels(items: LabelRequest[], opts: { left: number; right: number; lines: number; gap?: number }): LabelPlacement[] {
  const gap = opts.gap ?? 4;
  const ends: number[] = new Array(opts.lines).fill(Number.NEGATIVE_INFINITY);
  const out: LabelPlacement[] = new Array(items.length);
  const order = items.map((_, k) => k).sort((a, b) => items[a].x - items[b].x);
  for (const k of order) {
    const { x, width } = items[k];
    const left = Math.max(opts.left, Math.min(opts.right - width, x - width / 2));
    const line = ends.findIndex((end) => left >= end + gap);
    if (line < 0 || width > opts.right - opts.left) {
      out[k] = { left, line: -1, hidden: true };
      continue;
    }
    ends[line] = left + width;
    out[k] = { left, line, hidden: false };
  }
  return out;
}
