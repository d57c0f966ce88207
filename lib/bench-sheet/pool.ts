import { readEnv } from "@/lib/env";
import Piscina from "piscina";
import { DomainError } from "@/lib/errors";
import { workerBundleUrl } from "@/lib/worker-bundles";
import type { BenchSheetLayout } from "./types";

/** Too many sheets are waiting to be drawn. Maps to 503 with Retry-After. */
export class RendererBusyError extends DomainError {
  readonly status = 503;
  readonly code = "renderer_busy";
  readonly retryAfterSeconds = 5;
  constructor() {
    super("Too many bench sheets are being prepared right now; try again in a few seconds.");
  }
}

/** Sheets allowed to wait for a thread before new ones are refused with 503. */
export const MAX_QUEUED_SHEETS = 64;

const holder = globalThis as unknown as { sievewrightSheetPool?: Piscina };

/** How much a PDF thread lowers its scheduling priority (nice increment; 19 is the lowest priority). */
export const SHEET_THREAD_NICE = 10;

/**
 * Threads for drawing PDFs: PDF_WORKERS, default 1 (on a small machine one core stays free for requests).
 * @example pdfWorkerCount() // 1
 */
export function pdfWorkerCount(): number {
  return readEnv().PDF_WORKERS;
}

function pool(): Piscina {
  if (holder.sievewrightSheetPool) return holder.sievewrightSheetPool;
  const threads = pdfWorkerCount();
  // Drawn at a lower scheduling priority (nice +SHEET_THREAD_NICE, per thread on Linux), so requests that need the
  // CPU while PDFs are being made are served first.
  holder.sievewrightSheetPool = new Piscina({ filename: workerBundleUrl("bench-sheet"), minThreads: 0, maxThreads: threads, maxQueue: MAX_QUEUED_SHEETS, idleTimeout: 60_000, niceIncrement: SHEET_THREAD_NICE });
  return holder.sievewrightSheetPool;
}

/**
 * Draws a sheet on a worker thread, so the event loop keeps answering other requests meanwhile.
 * Throws RendererBusyError (503) when MAX_QUEUED_SHEETS are already waiting.
 * @example const pdf = await renderInWorker(buildBenchSheet(source, options)); // Uint8Array "%PDF-…"
 */
export async function renderInWorker(layout: BenchSheetLayout): Promise<Uint8Array> {
  try {
    return new Uint8Array(await pool().run(layout));
  } catch (err) {
    if (err instanceof Error && /queue is at limit/i.test(err.message)) throw new RendererBusyError();
    throw err;
  }
}
