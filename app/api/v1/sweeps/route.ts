import { computeSweep } from "@/lib/api/compute";
import { computeResponse, withServerTiming } from "@/lib/api/respond";
import { apiRoute, readJson } from "@/lib/http/api";

export const runtime = "nodejs";

/** POST /api/v1/sweeps — Re[K] maps over frequency × medium conductivity, row-major by conductivity (SI units). */
export const POST = withServerTiming(
  apiRoute("api.compute", async (req) => computeResponse(computeSweep(await readJson(req)))),
);
