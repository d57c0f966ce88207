import { apiRoute } from "@/lib/http/api";
import { recordRun } from "@/lib/runs/service";
import { readRunSubmission } from "@/lib/runs/upload";

export const runtime = "nodejs";

/**
 * POST /api/v1/runs (multipart/form-data: "run" = JSON of the run record in lab units, "attachments" = files).
 * Technicians only; 201 with the stored run (SI units), or 400/403/404/409/413 with a message and nothing stored.
 */
export const POST = apiRoute("run.record", async (req, caller) => {
  const { run, files } = await readRunSubmission(req);
  const saved = await recordRun(caller.user, run, files);
  return Response.json({ run: saved }, { status: 201 });
}, { accepts: ["multipart/form-data"] });
