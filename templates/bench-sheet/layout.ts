/**
 * Layout of the printed bench sheet: paper sizes, margins, font sizes, the order of the sections and the fixed texts
 * (cautions, the "not for bench use" mark). lib/bench-sheet reads these; change the sheet's look here, not in code.
 * Lengths are PDF points (1 pt = 1/72 inch).
 */

/** Paper sizes offered, in points (A4 = 210 × 297 mm; US Letter = 8.5 × 11 in). */
export const PAPER_SIZES = {
  a4: { label: "A4", width: 595.28, height: 841.89 },
  letter: { label: "US Letter", width: 612, height: 792 },
} as const;
export type PaperSize = keyof typeof PAPER_SIZES;

/** Page margins; the footer sits inside the bottom margin and grows with the number of signatures. */
export const MARGINS = { top: 46, side: 48, bottomBase: 44, footerLine: 10 } as const;

/** Font sizes (pt) and line spacing. */
export const FONT_SIZES = {
  title: 17,
  subtitle: 10,
  section: 11.5,
  body: 9.5,
  small: 8,
  footer: 7,
  running: 7.5,
  watermark: 64,
} as const;

/** Extra gap between lines of body text (pt), around blocks, inside table cells; height of a hand-writing line. */
export const SPACING = { line: 1.6, block: 6, section: 12, cell: 3, writing: 19 } as const;

/** Greys only: the sheet is photocopied and printed in black and white. 0 = black, 1 = white. */
export const GREYS = { text: "#000000", soft: "#333333", rule: "#777777", shade: "#e6e6e6", watermark: "#d2d2d2" } as const;

/** DejaVu Sans files (from the dejavu-fonts-ttf package), embedded in every sheet; resolved from the app's folder. */
export const FONT_FILES = {
  regular: "node_modules/dejavu-fonts-ttf/ttf/DejaVuSans.ttf",
  bold: "node_modules/dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf",
  oblique: "node_modules/dejavu-fonts-ttf/ttf/DejaVuSans-Oblique.ttf",
} as const;

/** Order of the sections on the sheet (ids used by lib/bench-sheet/layout.ts). */
export const SECTION_ORDER = [
  "status",
  "buffer",
  "acceptance",
  "cells",
  "settings",
  "populations",
  "warnings",
  "record",
  "cautions",
] as const;
export type SectionId = (typeof SECTION_ORDER)[number];

/** Section headings as printed. */
export const SECTION_TITLES: Record<SectionId, string> = {
  status: "Status of this version",
  buffer: "1. Buffer recipe",
  acceptance: "2. Buffer acceptance: check before use",
  cells: "3. Cell preparation",
  settings: "4. Generator and flow settings",
  populations: "5. What each population should do",
  warnings: "6. Warnings that apply at this operating point",
  record: "7. Run record (fill in by hand)",
  cautions: "8. Cautions",
};

/** The diagonal mark printed on every page of a version that is not approved and current. */
export const NOT_FOR_BENCH_MARK = "NOT FOR BENCH USE";

/** Temperatures (°C) at which the acceptance table lists the conductivity readings to accept. */
export const ACCEPTANCE_TABLE_TEMPERATURES = [20, 22, 25] as const;

/** Lines of the hand-filled run-record box: label, the unit written after the blank, and extra writing lines. */
export const RECORD_LINES: { label: string; unit?: string; lines?: number }[] = [
  { label: "Date and start time" },
  { label: "Technician (name, initials)" },
  { label: "Buffer lot" },
  { label: "Measured conductivity", unit: "µS/cm   at  ______ °C" },
  { label: "Compensated to 25 °C", unit: "µS/cm   within range?  yes / no" },
  { label: "Osmolality (if measured)", unit: "mOsm/kg" },
  { label: "Operating temperature", unit: "°C" },
  { label: "Frequency set", unit: "kHz" }, // unit replaced by the one the sheet prints the frequency in
  { label: "Voltage set", unit: "Vpp" },
  { label: "Flow rate", unit: "µL/min" },
  { label: "Minutes cells spent in the buffer", unit: "min" },
  { label: "Observed recovery", unit: "%" },
  { label: "Observed purity", unit: "%" },
  { label: "Counting method" },
  { label: "Deviations from this sheet", lines: 2 },
  { label: "Notes", lines: 2 },
  { label: "Signature" },
];

/** The standing cautions printed on every sheet. */
export const CAUTIONS: string[] = [
  "Electrical safety: the chip's electrodes are exposed and the signal generator (and any amplifier) drives them near liquids. Switch the output off before touching the chip, connectors or tubing, keep liquids away from the generator and mains leads, and never exceed the device's voltage limit printed above.",
  "Heating: the settings above were chosen to keep Joule heating within the planned limit. If bubbles, drift or unexpected streaming appear, switch the output off and record it as a deviation.",
  "Biosafety: handle the cells at the containment level your institution assigns to them, decontaminate spills, chip and waste by your local procedure, and wear the protective equipment it requires.",
  "These settings are model predictions signed for use by QA; verify the result on the bench. Where this sheet and your local rules or licensed practice differ, follow the local rules and report the difference.",
];

/** Text printed under the sheet's title. */
export const SHEET_SUBTITLE = "Bench sheet: buffer, cells, settings and run record for one signed protocol version";
