import { ARROW_STREAM, computeSweepArrow, wantsArrow } from "@/lib/api/arrow";
import { computeSweep } from "@/lib/api/compute";
import { computeEncoded, computeJson, withServerTiming } from "@/lib/api/respond";
import { apiRoute } from "@/lib/http/api";

export const runtime = "nodejs";

/**
 * POST /api/v1/sweeps — Re[K] maps over frequency × medium conductivity, row-major by conductivity (SI units).
 * JSON by default; Apache Arrow IPC (stream) with `Accept: application/vnd.apache.arrow.stream`.
 */
export const POST = withServerTiming(
  apiRoute("api.compute", (req) =>
    wantsArrow(req) ? computeEncoded(req, computeSweepArrow, (bytes) => bytes as Uint8Array<ArrayBuffer>, ARROW_STREAM) : computeJson(req, computeSweep),
  ),
);
