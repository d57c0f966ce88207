/**
 * The fit routes of the public API: crossovers → membrane C and G (full shell model by default), and single cells →
 * per-cell fits and the population's spread, fitted in the worker pool. With `Accept: application/x-ndjson` the cell
 * route streams one JSON line per progress step, then the result line.
 */
import { crossoverFitRequestSchema, fitMembrane, populationFitRequestSchema, type MembraneFit } from "@/lib/fitting";
import { ENGINE_VERSION } from "@/lib/dielectric";
import { ENGINE_VERSION_HEADER } from "@/lib/api/respond";
import { readJson } from "@/lib/http/body";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { prepareCellFit, runPreparedFit } from "./pool";

/**
 * Validates a crossover fit body and fits it (SI units). Throws InputError (→ 400) naming each bad field.
 * @example computeCrossoverFit({ points: [{ conductivity: 0.01, crossoverFrequency: 3.5e4 }, …], radius: 5e-6 }).capacitance.estimate
 */
export function computeCrossoverFit(body: unknown): MembraneFit {
  const { points, ...options } = parseOrThrow(crossoverFitRequestSchema, body);
  return fitMembrane(points, options);
}

/** Media type of the streamed answer. */
export const NDJSON = "application/x-ndjson";

/**
 * Answers POST /api/v1/fits/cells: validates the whole body first (400 naming fields), then fits in the worker pool;
 * JSON by default, or NDJSON lines `{"type":"progress","done":…,"total":…}` … `{"type":"result","result":…}` (or
 * `{"type":"error","message":…}`) when the client accepts application/x-ndjson.
 * @example await cellFitResponse(request) // Response
 */
export async function cellFitResponse(req: Request): Promise<Response> {
  const body = parseOrThrow(populationFitRequestSchema, await readJson(req));
  const { cells, exclude, include, ...common } = body;
  const prepared = prepareCellFit(cells, common);
  if (!(req.headers.get("accept") ?? "").includes(NDJSON))
    return Response.json(await runPreparedFit(prepared, { exclude, include, signal: req.signal }), { headers: { [ENGINE_VERSION_HEADER]: ENGINE_VERSION } });
  const enc = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (o: unknown) => controller.enqueue(enc.encode(JSON.stringify(o) + "\n"));
      try {
        const result = await runPreparedFit(prepared, { exclude, include, signal: req.signal, onProgress: (done, total) => send({ type: "progress", done, total }) });
        send({ type: "result", result });
      } catch (err) {
        if (!req.signal.aborted) {
          console.error("cell fit failed", err);
          send({ type: "error", message: "The fit failed on the server; it has been logged." });
        }
      } finally {
        controller.close();
      }
    },
  });
  return new Response(stream, { status: 200, headers: { "content-type": NDJSON, "cache-control": "no-store", [ENGINE_VERSION_HEADER]: ENGINE_VERSION } });
}
