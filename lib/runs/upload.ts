import { InputError } from "@/lib/errors";
import { readCappedFormData } from "@/lib/http/body";
import { formatFileSize } from "@/lib/units/size";
import { MAX_ATTACHMENTS, maxUploadBytes, type UploadFile } from "./attachments";

/**
 * Reads a multipart run submission: the field "run" (JSON of the run-record form) and the files "attachments".
 * The whole body is capped at MAX_ATTACHMENTS × UPLOAD_MAX_MB + 1 MB while it streams in (lib/http/body.ts).
 * @example const { run, files } = await readRunSubmission(req);
 */
export async function readRunSubmission(req: Request): Promise<{ run: unknown; files: UploadFile[] }> {
  const cap = MAX_ATTACHMENTS * maxUploadBytes() + 1024 * 1024;
  const form = await readCappedFormData(req, cap, `run upload (at most ${MAX_ATTACHMENTS} files of ${formatFileSize(maxUploadBytes())} each)`);
  const rawRun = form.get("run");
  if (typeof rawRun !== "string") throw new InputError([{ path: "run", message: "The 'run' field (JSON of the run record) is missing." }]);
  let run: unknown;
  try {
    run = JSON.parse(rawRun);
  } catch {
    throw new InputError([{ path: "run", message: "The 'run' field is not valid JSON." }]);
  }
  const files: UploadFile[] = [];
  for (const entry of form.getAll("attachments")) {
    if (typeof entry === "string") continue;
    files.push({ name: entry.name, bytes: new Uint8Array(await entry.arrayBuffer()) });
  }
  return { run, files };
}
