import { renderBenchSheet } from "./render";
import type { BenchSheetLayout } from "./types";

/**
 * Worker-thread entry of the bench-sheet renderer (bundled by scripts/build-workers.mjs into
 * build/workers/bench-sheet.mjs and run by the pool in pool.ts): a layout in, the PDF's bytes out.
 * @example await pool.run(layout) // Uint8Array starting with "%PDF-"
 */
export default async function renderInThread(layout: BenchSheetLayout): Promise<Uint8Array> {
  const pdf = await renderBenchSheet(layout);
  return new Uint8Array(pdf.buffer, pdf.byteOffset, pdf.byteLength);
}
