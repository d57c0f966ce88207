import { windowsCsvOf } from "@/lib/exports/compute-csv";
import { csvResponse } from "@/lib/exports/respond";
import { apiRoute } from "@/lib/http/api";
import { readJson } from "@/lib/http/body";

export const runtime = "nodejs";

/** POST /api/v1/windows/table.csv — the ranked windows of a windows request as CSV, units in the headers. */
export const POST = apiRoute("api.compute", async (req) => csvResponse(windowsCsvOf(await readJson(req)), "sievewright-windows.csv"));
