import { sweepMapCsvOf } from "@/lib/exports/compute-csv";
import { csvResponse } from "@/lib/exports/respond";
import { apiRoute } from "@/lib/http/api";
import { readJson } from "@/lib/http/body";

export const runtime = "nodejs";

/** POST /api/v1/windows/map.csv — the sweep map of a windows request in long format (one row per frequency × conductivity point), CSV with units in the headers. */
export const POST = apiRoute("api.compute", async (req) => csvResponse(sweepMapCsvOf(await readJson(req)), "sievewright-sweep-map.csv"));
