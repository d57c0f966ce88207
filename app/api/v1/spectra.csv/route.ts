import { spectraCsvOf } from "@/lib/exports/compute-csv";
import { csvResponse } from "@/lib/exports/respond";
import { apiRoute } from "@/lib/http/api";
import { readJson } from "@/lib/http/body";

export const runtime = "nodejs";

/** POST /api/v1/spectra.csv — Re[K] and Im[K] of each particle in one medium as CSV, units in the headers. */
export const POST = apiRoute("api.compute", async (req) => csvResponse(spectraCsvOf(await readJson(req)), "sievewright-spectra.csv"));
