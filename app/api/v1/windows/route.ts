import { computeJson, withServerTiming } from "@/lib/api/respond";
import { computeWindows } from "@/lib/api/windows";
import { apiRoute } from "@/lib/http/api";

export const runtime = "nodejs";

/** POST /api/v1/windows — ranked operating windows for two populations with spreads, a medium and a device (SI units). */
export const POST = withServerTiming(
  apiRoute("api.compute", (req) => computeJson(req, computeWindows)),
);
