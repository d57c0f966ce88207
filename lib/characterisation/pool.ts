/**
 * Cell fits off the request thread: a Piscina pool of worker threads running the pure engine, so a population of
 * hundreds of cells neither blocks other requests nor waits on one core. The worker entry (fit-worker.ts) is bundled
 * by scripts/build-workers.mjs into build/workers/cell-fit.mjs, plain JavaScript that a thread loads in well under a
 * second, so the pool works the same under `next start` and under tsx/vitest.
 */
import os from "node:os";
import { Piscina } from "piscina";
import {
  cellSpectrumRequestSchema,
  checkCells,
  summarisePopulation,
  type CellInput,
  type CellResult,
  type CommonSetup,
  type PopulationFit,
} from "@/lib/fitting";
import { FittingInputError } from "@/lib/fitting/errors";
import { workerBundleUrl } from "@/lib/worker-bundles";
import type { FitTask } from "./fit-worker";

/** How much a fit thread lowers its scheduling priority (nice increment; 19 is the lowest priority). */
export const FIT_THREAD_NICE = 10;

/** Cells per task: small enough for smooth progress, large enough that messaging costs little. */
export const CELLS_PER_TASK = 20;

const holder = globalThis as unknown as { sievewrightFitPool?: Piscina<FitTask, CellResult[]> };

/** Worker threads: one per core, at most 4, at least 1. */
export function poolSize(): number {
  return Math.max(1, Math.min(4, os.availableParallelism()));
}

/**
 * The process's one pool (kept on globalThis: Next loads this module once per route bundle, and the server's start
 * hook in instrumentation.ts once more, so a module variable would give each its own threads). Its poolSize()
 * threads start with it and stay (minThreads = maxThreads), each warmed up as it starts (fit-worker.ts), at a lower
 * scheduling priority (nice +FIT_THREAD_NICE; per thread on Linux): a fit uses every idle core, but a page or API
 * request that needs the CPU is served first.
 */
function getPool(): Piscina<FitTask, CellResult[]> {
  if (!holder.sievewrightFitPool) {
    const threads = poolSize();
    const pool = new Piscina<FitTask, CellResult[]>({ filename: workerBundleUrl("cell-fit"), maxThreads: threads, minThreads: threads, idleTimeout: 60_000, niceIncrement: FIT_THREAD_NICE });
    pool.on("error", (err) => console.error("cell-fit worker pool error", err));
    holder.sievewrightFitPool = pool;
  }
  return holder.sievewrightFitPool;
}

/**
 * Starts the pool's threads now (called once as the server starts, from instrumentation.ts), so the first fit a user
 * asks for does not wait for threads to start and warm up; they load and warm up in the background.
 * @example startFitPool();
 */
export function startFitPool(): void {
  getPool();
}

/** Stops the pool's threads (tests and shutdown). */
export async function closeFitPool(): Promise<void> {
  const p = holder.sievewrightFitPool;
  holder.sievewrightFitPool = undefined;
  if (p) await p.close({ force: true });
}

/** Cells and setup checked once, ready for the pool. */
export interface PreparedFit {
  cells: CellInput[];
  setup: CommonSetup;
}

/**
 * Checks the cells and what they share (with the first cell), so a bad request fails before any work with each bad
 * field named. Throws FittingInputError.
 * @example prepareCellFit(cells, { kind: "re-k", medium, particle, fit: ["membraneCapacitance"] }).cells.length
 */
export function prepareCellFit(cells: unknown, common: CommonSetup): PreparedFit {
  const list = checkCells(cells);
  const parsed = cellSpectrumRequestSchema.safeParse({ ...common, radius: list[0].radius, points: list[0].points });
  if (!parsed.success) throw new FittingInputError(parsed.error.issues.map((i) => ({ path: i.path.join(".") || "request", message: i.message })));
  const { kind, medium, field, particle, fit } = parsed.data;
  return { cells: list, setup: { kind, medium, field, particle, fit } };
}

/**
 * Fits every cell in worker threads, reporting progress after each chunk, then flags outliers and summarises the
 * population (mean, CV, n, distribution per fitted parameter and radius). Throws FittingInputError for bad input.
 * @example await fitCellsInPool(cells, { kind: "dep-velocity", medium, field, particle, fit: ["membraneCapacitance"] }, { onProgress: (d, n) => … })
 */
export async function fitCellsInPool(
  cells: unknown,
  common: CommonSetup,
  options: { exclude?: string[]; include?: string[]; onProgress?: (done: number, total: number) => void; signal?: AbortSignal } = {},
): Promise<PopulationFit> {
  return runPreparedFit(prepareCellFit(cells, common), options);
}

/**
 * Runs a prepared fit in the pool (see fitCellsInPool).
 * @example await runPreparedFit(prepareCellFit(cells, common), { onProgress })
 */
export async function runPreparedFit(
  prepared: PreparedFit,
  options: { exclude?: string[]; include?: string[]; onProgress?: (done: number, total: number) => void; signal?: AbortSignal } = {},
): Promise<PopulationFit> {
  const { cells: list, setup } = prepared;
  const chunks: FitTask[] = [];
  for (let i = 0; i < list.length; i += CELLS_PER_TASK) chunks.push({ cells: list.slice(i, i + CELLS_PER_TASK), common: setup });
  let done = 0;
  const results = await Promise.all(
    chunks.map(async (task) => {
      const r = await getPool().run(task, options.signal ? { signal: options.signal } : {});
      done += task.cells.length;
      options.onProgress?.(done, list.length);
      return r;
    }),
  );
  const flat = results.flat();
  const summary = summarisePopulation(flat, setup.fit, options);
  const first = flat.find((r) => r.fit)?.fit;
  return { ...summary, model: first?.model ?? "", intervalNote: first?.intervalNote ?? "" };
}
