import { computeCrossoverFit } from "@/lib/characterisation/api";
import { computeJson, withServerTiming } from "@/lib/api/respond";
import { apiRoute } from "@/lib/http/api";

export const runtime = "nodejs";

/** POST /api/v1/fits/crossovers — membrane C and G from first crossovers, full shell model by default (SI units). */
export const POST = withServerTiming(apiRoute("api.compute", (req) => computeJson(req, computeCrossoverFit)));
