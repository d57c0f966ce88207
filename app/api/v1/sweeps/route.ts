import { computeSweep } from "@/lib/api/compute";
import { computeJson, withServerTiming } from "@/lib/api/respond";
import { apiRoute } from "@/lib/http/api";

export const runtime = "nodejs";

/** POST /api/v1/sweeps — Re[K] maps over frequency × medium conductivity, row-major by conductivity (SI units). */
export const POST = withServerTiming(
  apiRoute("api.compute", (req) => computeJson(req, computeSweep)),
);
