/**
 * The HTTP envelope shared by the compute routes: JSON with the engine version and the server's own time.
 */
import { ENGINE_VERSION } from "@/lib/dielectric";

/** Header carrying the engine version that produced a result (also in the OpenAPI document). */
export const ENGINE_VERSION_HEADER = "x-engine-version";

/**
 * A 200 JSON response with `x-engine-version`.
 * @example return computeResponse({ frequencies: [1e6], particles: [] });
 */
export function computeResponse(result: unknown): Response {
  return new Response(JSON.stringify(result), {
    status: 200,
    headers: { "content-type": "application/json", [ENGINE_VERSION_HEADER]: ENGINE_VERSION },
  });
}

/**
 * Wraps a route handler so every response (success or error) carries `server-timing: app;dur=<ms>`, the time from
 * receiving the request to having the whole body ready, in milliseconds.
 * @example export const POST = withServerTiming(apiRoute("api.compute", handler));
 */
export function withServerTiming<C>(handler: (req: Request, ctx: C) => Promise<Response>) {
  return async (req: Request, ctx: C): Promise<Response> => {
    const started = performance.now();
    const res = await handler(req, ctx);
    res.headers.set("server-timing", `app;dur=${(performance.now() - started).toFixed(2)}`);
    return res;
  };
}
