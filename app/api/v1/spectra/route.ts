import { computeSpectra } from "@/lib/api/compute";
import { computeJson, withServerTiming } from "@/lib/api/respond";
import { apiRoute } from "@/lib/http/api";

export const runtime = "nodejs";

/** POST /api/v1/spectra — Re[K], Im[K] and crossovers of each particle in one medium (SI units). */
export const POST = withServerTiming(
  apiRoute("api.compute", (req) => computeJson(req, computeSpectra)),
);
