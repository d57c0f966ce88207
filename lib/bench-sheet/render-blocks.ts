import type PDFDocument from "pdfkit";
import { FONT_SIZES, GREYS, SPACING } from "@/templates/bench-sheet/layout";
import type { SheetBlock } from "./types";

type Doc = InstanceType<typeof PDFDocument>;

/** Geometry every drawing helper needs: page size and the content box (points). */
export interface PageFrame {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
  contentWidth: number;
}

const BODY = { lineGap: SPACING.line };

/** Starts a new page when `height` points do not fit below the cursor. */
function ensure(doc: Doc, frame: PageFrame, height: number): void {
  if (doc.y + height > frame.bottom) doc.addPage();
}

function paragraph(doc: Doc, frame: PageFrame, text: string, style: "body" | "strong" | "note" | "formula"): void {
  const font = style === "strong" ? "bold" : style === "note" ? "oblique" : "regular";
  const size = style === "note" ? FONT_SIZES.small + 0.5 : FONT_SIZES.body;
  const pad = style === "formula" || style === "strong" ? 6 : 0;
  doc.font(font).fontSize(size);
  const width = frame.contentWidth - 2 * pad;
  const h = doc.heightOfString(text, { width, ...BODY });
  ensure(doc, frame, Math.min(h + 2 * pad, frame.bottom - frame.top));
  const y = doc.y;
  doc.font(font).fontSize(size).fillColor(GREYS.text).text(text, frame.left + pad, y + pad, { width, ...BODY });
  if (pad) {
    doc.rect(frame.left, y, frame.contentWidth, h + 2 * pad).lineWidth(style === "strong" ? 1.5 : 0.6).strokeColor(GREYS.text).stroke();
    doc.y = y + h + 2 * pad;
  }
}

function fields(doc: Doc, frame: PageFrame, rows: { label: string; value: string }[]): void {
  const labelWidth = Math.round(frame.contentWidth * 0.27);
  const valueWidth = frame.contentWidth - labelWidth - 8;
  for (const row of rows) {
    doc.font("bold").fontSize(FONT_SIZES.body);
    const hl = doc.heightOfString(row.label, { width: labelWidth, ...BODY });
    doc.font("regular");
    const hv = doc.heightOfString(row.value, { width: valueWidth, ...BODY });
    const h = Math.max(hl, hv);
    ensure(doc, frame, h + 2);
    const y = doc.y;
    doc.font("bold").fontSize(FONT_SIZES.body).fillColor(GREYS.text).text(row.label, frame.left, y, { width: labelWidth, ...BODY });
    doc.font("regular").text(row.value, frame.left + labelWidth + 8, y, { width: valueWidth, ...BODY });
    doc.y = y + h + 2;
  }
}

function tableRow(doc: Doc, frame: PageFrame, cells: string[], widths: number[], header: boolean): number {
  const pad = SPACING.cell;
  doc.font(header ? "bold" : "regular").fontSize(FONT_SIZES.body);
  const heights = cells.map((c, i) => doc.heightOfString(c, { width: widths[i] - 2 * pad, ...BODY }));
  return Math.max(...heights) + 2 * pad;
}

function drawRow(doc: Doc, frame: PageFrame, cells: string[], widths: number[], header: boolean, height: number): void {
  const pad = SPACING.cell;
  const y = doc.y;
  if (header) doc.rect(frame.left, y, frame.contentWidth, height).fillColor(GREYS.shade).fill();
  doc.fillColor(GREYS.text).font(header ? "bold" : "regular").fontSize(FONT_SIZES.body);
  let x = frame.left;
  cells.forEach((c, i) => {
    doc.text(c, x + pad, y + pad, { width: widths[i] - 2 * pad, ...BODY });
    x += widths[i];
  });
  doc.moveTo(frame.left, y + height).lineTo(frame.right, y + height).lineWidth(0.5).strokeColor(GREYS.rule).stroke();
  doc.y = y + height;
}

/** Height to keep together: the whole table when it is short (≤ 8 rows), else its header and first row. */
function tableKeepHeight(doc: Doc, frame: PageFrame, columns: { title: string; width: number }[], rows: string[][], caption?: string): number {
  const widths = columns.map((c) => c.width * frame.contentWidth);
  const head = tableRow(doc, frame, columns.map((c) => c.title), widths, true);
  const kept = rows.length <= 8 ? rows : rows.slice(0, 1);
  doc.font("regular").fontSize(FONT_SIZES.body);
  const captionHeight = caption ? doc.heightOfString(caption, { width: frame.contentWidth, ...BODY }) + 4 : 0;
  return captionHeight + head + kept.reduce((sum, r) => sum + tableRow(doc, frame, r, widths, false), 0);
}

function recordHeight(lines: { lines?: number }[]): number {
  return lines.reduce((n, l) => n + 1 + (l.lines ?? 0), 0) * SPACING.writing + 16;
}

function table(doc: Doc, frame: PageFrame, columns: { title: string; width: number }[], rows: string[][], caption?: string): void {
  const widths = columns.map((c) => c.width * frame.contentWidth);
  const titles = columns.map((c) => c.title);
  const headHeight = tableRow(doc, frame, titles, widths, true);
  ensure(doc, frame, tableKeepHeight(doc, frame, columns, rows, caption));
  if (caption) {
    doc.font("regular").fontSize(FONT_SIZES.body).fillColor(GREYS.text).text(caption, frame.left, doc.y, { width: frame.contentWidth, ...BODY });
    doc.y += 4;
  }
  drawRow(doc, frame, titles, widths, true, headHeight);
  for (const row of rows) {
    const h = tableRow(doc, frame, row, widths, false);
    if (doc.y + h > frame.bottom) {
      doc.addPage();
      drawRow(doc, frame, titles, widths, true, headHeight);
    }
    drawRow(doc, frame, row, widths, false, h);
  }
}

function list(doc: Doc, frame: PageFrame, items: string[], numbered: boolean): void {
  const indent = 16;
  doc.font("regular").fontSize(FONT_SIZES.body);
  items.forEach((item, i) => {
    const width = frame.contentWidth - indent;
    const h = doc.heightOfString(item, { width, ...BODY });
    ensure(doc, frame, Math.min(h, 60) + 2);
    const y = doc.y;
    doc.font("regular").fontSize(FONT_SIZES.body).fillColor(GREYS.text).text(numbered ? `${i + 1}.` : "•", frame.left, y, { width: indent, lineBreak: false });
    doc.text(item, frame.left + indent, y, { width, ...BODY });
    doc.y += 2;
  });
}

function record(doc: Doc, frame: PageFrame, lines: { label: string; unit?: string; lines?: number }[]): void {
  const rowHeight = SPACING.writing;
  const pad = 8;
  const total = recordHeight(lines);
  ensure(doc, frame, total);
  const top = doc.y;
  const labelWidth = Math.round(frame.contentWidth * 0.36);
  let y = top + pad;
  doc.fontSize(FONT_SIZES.body).fillColor(GREYS.text);
  for (const line of lines) {
    doc.font("bold").text(line.label, frame.left + pad, y + rowHeight - 12, { width: labelWidth, lineBreak: false, ellipsis: true });
    let unitWidth = 0;
    if (line.unit) {
      doc.font("regular");
      unitWidth = doc.widthOfString(line.unit) + 6;
      doc.text(line.unit, frame.right - pad - unitWidth + 6, y + rowHeight - 12, { lineBreak: false });
    }
    const x0 = frame.left + pad + labelWidth;
    doc.moveTo(x0, y + rowHeight - 2).lineTo(frame.right - pad - unitWidth, y + rowHeight - 2).lineWidth(0.5).strokeColor(GREYS.rule).stroke();
    for (let k = 1; k <= (line.lines ?? 0); k++) {
      const yy = y + rowHeight * (k + 1) - 2;
      doc.moveTo(frame.left + pad, yy).lineTo(frame.right - pad, yy).lineWidth(0.5).strokeColor(GREYS.rule).stroke();
    }
    y += rowHeight * (1 + (line.lines ?? 0));
  }
  doc.rect(frame.left, top, frame.contentWidth, total).lineWidth(1.2).strokeColor(GREYS.text).stroke();
  doc.y = top + total;
}

/**
 * The height (pt) that must fit below a section title together with this block, so a title never ends a page alone.
 * @example keepHeight(doc, frame, { kind: "record", lines }) // the whole run-record box
 */
export function keepHeight(doc: Doc, frame: PageFrame, block: SheetBlock): number {
  doc.font("regular").fontSize(FONT_SIZES.body);
  switch (block.kind) {
    case "record":
      return recordHeight(block.lines);
    case "table":
      return tableKeepHeight(doc, frame, block.columns, block.rows, block.caption);
    case "paragraph":
      return Math.min(60, doc.heightOfString(block.text, { width: frame.contentWidth, ...BODY }) + 12);
    default:
      return 40;
  }
}

/**
 * Draws one block of a section at the cursor, starting a new page where it would not fit.
 * @example drawBlock(doc, frame, { kind: "paragraph", text: "Mix well." })
 */
export function drawBlock(doc: Doc, frame: PageFrame, block: SheetBlock): void {
  doc.x = frame.left;
  switch (block.kind) {
    case "paragraph":
      return paragraph(doc, frame, block.text, block.style ?? "body");
    case "fields":
      return fields(doc, frame, block.rows);
    case "table":
      return table(doc, frame, block.columns, block.rows, block.caption);
    case "steps":
      return list(doc, frame, block.items, true);
    case "bullets":
      return list(doc, frame, block.items, false);
    case "record":
      return record(doc, frame, block.lines);
  }
}
