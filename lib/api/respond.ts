/**
 * The HTTP envelope shared by the compute routes: JSON with the engine version, and a Server-Timing header that
 * splits the server's time into reading the body, computing, serialising and the whole request.
 */
import { ENGINE_VERSION } from "@/lib/dielectric";
import { readJson } from "@/lib/http/body";
import { serverTimingDuration } from "@/lib/units/duration";

/** Header carrying the engine version that produced a result (also in the OpenAPI document). */
export const ENGINE_VERSION_HEADER = "x-engine-version";

/**
 * Reads the JSON body, runs `compute` on it and answers 200 JSON with `x-engine-version` and
 * `server-timing: read;dur=…, compute;dur=…, serialize;dur=…` (milliseconds). Errors propagate to apiRoute.
 * @example apiRoute("api.compute", (req) => computeJson(req, computeSweep))
 */
export async function computeJson(req: Request, compute: (body: unknown) => unknown): Promise<Response> {
  return computeEncoded(req, compute, (result) => JSON.stringify(result), "application/json");
}

/**
 * The same envelope for any encoding: `encode` turns the computed result into the body sent with `contentType`.
 * @example computeEncoded(req, computeSweep, JSON.stringify, "application/json")
 */
export async function computeEncoded<T>(req: Request, compute: (body: unknown) => T, encode: (result: T) => BodyInit, contentType: string): Promise<Response> {
  const t0 = performance.now();
  const body = await readJson(req);
  const t1 = performance.now();
  const result = compute(body);
  const t2 = performance.now();
  const encoded = encode(result);
  const t3 = performance.now();
  return new Response(encoded, {
    status: 200,
    headers: {
      "content-type": contentType,
      vary: "accept",
      [ENGINE_VERSION_HEADER]: ENGINE_VERSION,
      "server-timing": `read;dur=${serverTimingDuration(t1 - t0)}, compute;dur=${serverTimingDuration(t2 - t1)}, serialize;dur=${serverTimingDuration(t3 - t2)}`,
    },
  });
}

/**
 * Wraps a route handler so every response (success or error) also carries `server-timing: app;dur=<ms>`: the time
 * from entering the handler (before authentication) to having the whole body ready.
 * @example export const POST = withServerTiming(apiRoute("api.compute", handler));
 */
export function withServerTiming<C>(handler: (req: Request, ctx: C) => Promise<Response>) {
  return async (req: Request, ctx: C): Promise<Response> => {
    const started = performance.now();
    const res = await handler(req, ctx);
    res.headers.append("server-timing", `app;dur=${serverTimingDuration(performance.now() - started)}`);
    return res;
  };
}
