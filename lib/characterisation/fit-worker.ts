/**
 * The task one worker thread runs: fit a chunk of cells with the pure engine (lib/fitting). Bundled by
 * scripts/build-workers.mjs into build/workers/cell-fit.mjs, which the pool in pool.ts loads; never imported by the
 * app bundle. As the thread loads this file it runs a small warm-up fit (warm-up.ts), so the engine is compiled before
 * the first population arrives.
 */
import { fitOneCell, type CellInput, type CellResult, type CommonSetup } from "@/lib/fitting";
import { runWarmUp } from "./warm-up";

/** A chunk of cells and what they share. */
export interface FitTask {
  cells: CellInput[];
  common: CommonSetup;
}

runWarmUp();

/**
 * Fits each cell of the chunk.
 * @example fitChunk({ cells: [cell], common }) // → [CellResult]
 */
export default function fitChunk(task: FitTask): CellResult[] {
  return task.cells.map((cell) => fitOneCell(cell, task.common));
}
