import { existsSync } from "node:fs";
import path from "node:path";
import PDFDocument from "pdfkit";
import { FONT_FILES, FONT_SIZES, GREYS, MARGINS, PAPER_SIZES, SHEET_SUBTITLE, SPACING } from "@/templates/bench-sheet/layout";
import type { BenchSheetLayout, SheetBlock } from "./types";
import { drawBlock, keepHeight, type PageFrame } from "./render-blocks";

type Doc = InstanceType<typeof PDFDocument>;

/**
 * Absolute paths of the embedded DejaVu Sans files, resolved from the app's folder (process.cwd()) at run time.
 * @example fontPaths().regular // "/srv/sievewright/node_modules/dejavu-fonts-ttf/ttf/DejaVuSans.ttf"
 */
export function fontPaths(root = process.cwd()): Record<keyof typeof FONT_FILES, string> {
  const resolved = {
    regular: path.join(root, FONT_FILES.regular),
    bold: path.join(root, FONT_FILES.bold),
    oblique: path.join(root, FONT_FILES.oblique),
  };
  for (const file of Object.values(resolved)) {
    if (!existsSync(file)) throw new Error(`Bench sheet font missing: ${file}. Install the dejavu-fonts-ttf package (npm ci).`);
  }
  return resolved;
}

/** pdfkit keeps the current font on the document; a page break in mid-text must not change it. */
type FontState = { _font: unknown; _fontSize: number; _fillColor: unknown };
function fontState(doc: Doc): FontState {
  const d = doc as unknown as FontState;
  return { _font: d._font, _fontSize: d._fontSize, _fillColor: d._fillColor };
}
function restoreFontState(doc: Doc, saved: FontState): void {
  const d = doc as unknown as FontState;
  d._font = saved._font;
  d._fontSize = saved._fontSize;
  if (Array.isArray(saved._fillColor)) doc.fillColor(saved._fillColor[0], saved._fillColor[1]);
}

function footerHeight(layout: BenchSheetLayout): number {
  return MARGINS.bottomBase + (layout.footer.signatureLines.length + 1) * MARGINS.footerLine;
}

function drawMark(doc: Doc, frame: PageFrame, mark: string): void {
  const angle = (Math.atan2(frame.height, frame.width) * 180) / Math.PI;
  doc.save();
  doc.font("bold").fontSize(FONT_SIZES.watermark);
  const w = doc.widthOfString(mark);
  const cx = frame.width / 2;
  const cy = frame.height / 2;
  doc.rotate(-angle, { origin: [cx, cy] });
  doc.fillColor(GREYS.watermark).text(mark, cx - w / 2, cy - FONT_SIZES.watermark / 2, { lineBreak: false });
  doc.restore();
  doc.fillColor(GREYS.text);
}

function drawRunningHeader(doc: Doc, frame: PageFrame, layout: BenchSheetLayout): void {
  doc.font("regular").fontSize(FONT_SIZES.running).fillColor(GREYS.soft);
  doc.text(layout.header.runningHeader, frame.left, frame.top - 22, { width: frame.contentWidth, lineBreak: false, ellipsis: true });
  doc.moveTo(frame.left, frame.top - 10).lineTo(frame.right, frame.top - 10).lineWidth(0.5).strokeColor(GREYS.rule).stroke();
  doc.fillColor(GREYS.text);
}

function drawTitleBlock(doc: Doc, frame: PageFrame, layout: BenchSheetLayout): void {
  const h = layout.header;
  doc.font("regular").fontSize(FONT_SIZES.small).fillColor(GREYS.soft).text(SHEET_SUBTITLE, frame.left, frame.top, { width: frame.contentWidth });
  doc.moveDown(0.3);
  doc.font("bold").fontSize(FONT_SIZES.title).fillColor(GREYS.text).text(`${h.code}  ${h.title}`, { width: frame.contentWidth });
  doc.moveDown(0.2);
  doc.font("bold").fontSize(FONT_SIZES.subtitle).text(`${h.versionLabel} · ${h.stateLabel}`, { continued: true });
  doc.font("regular").text(`    ${h.meta}`);
  if (h.purpose.trim()) {
    doc.moveDown(0.2);
    doc.font("oblique").fontSize(FONT_SIZES.small).fillColor(GREYS.soft).text(h.purpose.trim(), { width: frame.contentWidth });
  }
  doc.fillColor(GREYS.text);
  const y = doc.y + 5;
  doc.moveTo(frame.left, y).lineTo(frame.right, y).lineWidth(1).strokeColor(GREYS.text).stroke();
  doc.y = y + SPACING.section / 2;
}

function drawFooters(doc: Doc, frame: PageFrame, layout: BenchSheetLayout): void {
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const savedBottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    let y = frame.height - footerHeight(layout) + 12;
    doc.moveTo(frame.left, y - 4).lineTo(frame.right, y - 4).lineWidth(0.5).strokeColor(GREYS.rule).stroke();
    doc.font("regular").fontSize(FONT_SIZES.footer).fillColor(GREYS.text);
    for (const line of layout.footer.signatureLines) {
      doc.text(line, frame.left, y, { width: frame.contentWidth, lineBreak: false, ellipsis: true });
      y += MARGINS.footerLine;
    }
    const pageText = `Page ${i - range.start + 1} of ${range.count}`;
    const pageWidth = doc.widthOfString(pageText);
    doc.text(layout.footer.hashLine, frame.left, y, { width: frame.contentWidth - pageWidth - 12, lineBreak: false, ellipsis: true });
    doc.font("bold").text(pageText, frame.right - pageWidth, y, { lineBreak: false });
    doc.page.margins.bottom = savedBottom;
  }
}

/**
 * Draws a bench-sheet layout into a PDF (pdfkit, DejaVu Sans embedded) and returns its bytes. Every page carries the
 * footer (signatures, content hash, "Page X of Y") and, when `layout.mark` is set, the diagonal mark under the text.
 * @example const pdf = await renderBenchSheet(buildBenchSheet(source, { volumeMl: 100, paper: "a4", printedAt: new Date() }));
 */
export async function renderBenchSheet(layout: BenchSheetLayout): Promise<Buffer> {
  const paper = PAPER_SIZES[layout.paper];
  const fonts = fontPaths();
  const bottom = footerHeight(layout);
  const doc: Doc = new PDFDocument({
    size: [paper.width, paper.height],
    margins: { top: MARGINS.top, left: MARGINS.side, right: MARGINS.side, bottom },
    bufferPages: true,
    autoFirstPage: false,
    font: fonts.regular,
    info: { Title: `${layout.header.code} ${layout.header.versionLabel} bench sheet`, Author: "Sievewright", Subject: layout.header.title },
  });
  doc.registerFont("regular", fonts.regular);
  doc.registerFont("bold", fonts.bold);
  doc.registerFont("oblique", fonts.oblique);
  const frame: PageFrame = {
    width: paper.width,
    height: paper.height,
    left: MARGINS.side,
    right: paper.width - MARGINS.side,
    top: MARGINS.top,
    bottom: paper.height - bottom,
    contentWidth: paper.width - 2 * MARGINS.side,
  };
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  let first = true;
  doc.on("pageAdded", () => {
    const saved = fontState(doc);
    if (layout.mark) drawMark(doc, frame, layout.mark);
    if (!first) drawRunningHeader(doc, frame, layout);
    restoreFontState(doc, saved);
    doc.x = frame.left;
    doc.y = frame.top;
  });
  doc.addPage();
  drawTitleBlock(doc, frame, layout);
  first = false;
  for (const section of layout.sections) drawSection(doc, frame, section.title, section.blocks);
  drawFooters(doc, frame, layout);
  doc.end();
  return done;
}

function drawSection(doc: Doc, frame: PageFrame, title: string, blocks: SheetBlock[]): void {
  doc.font("bold").fontSize(FONT_SIZES.section);
  const titleHeight = doc.heightOfString(title, { width: frame.contentWidth }) + 6;
  const keepWith = blocks.length > 0 ? Math.min(keepHeight(doc, frame, blocks[0]), frame.bottom - frame.top - titleHeight) : 0;
  if (doc.y + titleHeight + keepWith > frame.bottom) doc.addPage();
  doc.font("bold").fontSize(FONT_SIZES.section);
  const y = doc.y;
  doc.rect(frame.left, y, frame.contentWidth, titleHeight).fillColor(GREYS.shade).fill();
  doc.fillColor(GREYS.text).text(title, frame.left + 4, y + 3, { width: frame.contentWidth - 8 });
  doc.y = y + titleHeight + SPACING.block;
  for (const block of blocks) {
    drawBlock(doc, frame, block);
    doc.y += SPACING.block;
  }
  doc.y += SPACING.section - SPACING.block;
  doc.x = frame.left;
}
