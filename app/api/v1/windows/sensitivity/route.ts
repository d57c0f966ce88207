import { computeJson, withServerTiming } from "@/lib/api/respond";
import { computeSensitivity } from "@/lib/api/windows";
import { apiRoute } from "@/lib/http/api";

export const runtime = "nodejs";

/** POST /api/v1/windows/sensitivity — how far ±1 SD of each population parameter moves a window's band edges. */
export const POST = withServerTiming(
  apiRoute("api.compute", (req) => computeJson(req, computeSensitivity)),
);
