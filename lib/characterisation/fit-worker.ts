/**
 * The task one worker thread runs: fit a chunk of cells with the pure engine (lib/fitting). Bundled by
 * scripts/build-workers.mjs into build/workers/cell-fit.mjs, which the pool in pool.ts loads; never imported by the
 * app bundle.
 */
import { fitOneCell, type CellInput, type CellResult, type CommonSetup } from "@/lib/fitting";

/** A chunk of cells and what they share. */
export interface FitTask {
  cells: CellInput[];
  common: CommonSetup;
}

/**
 * Fits each cell of the chunk.
 * @example fitChunk({ cells: [cell], common }) // → [CellResult]
 */
export default function fitChunk(task: FitTask): CellResult[] {
  return task.cells.map((cell) => fitOneCell(cell, task.common));
}
