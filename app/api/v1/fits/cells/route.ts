import { cellFitResponse } from "@/lib/characterisation/api";
import { withServerTiming } from "@/lib/api/respond";
import { apiRoute } from "@/lib/http/api";

export const runtime = "nodejs";

/** POST /api/v1/fits/cells — fit each cell's spectrum (in worker threads) and the population's spread (SI units). */
export const POST = withServerTiming(apiRoute("api.compute", (req) => cellFitResponse(req)));
