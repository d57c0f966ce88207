import { InputError, TooLargeError } from "@/lib/errors";
import { MAX_ATTACHMENTS, maxUploadBytes, type UploadFile } from "./attachments";

/**
 * Reads a multipart run submission: the field "run" (JSON of the run-record form) and the files "attachments".
 * The whole body is capped at MAX_ATTACHMENTS × UPLOAD_MAX_MB + 1 MB before it is read.
 * @example const { run, files } = await readRunSubmission(req);
 */
export async function readRunSubmission(req: Request): Promise<{ run: unknown; files: UploadFile[] }> {
  const cap = MAX_ATTACHMENTS * maxUploadBytes() + 1024 * 1024;
  const declared = Number(req.headers.get("content-length") ?? 0);
  if (declared > cap) throw new TooLargeError(`The upload is ${Math.round(declared / 1024 / 1024)} MB; at most ${MAX_ATTACHMENTS} files of ${Math.round(maxUploadBytes() / 1024 / 1024)} MB each are accepted.`);
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new InputError([{ path: "", message: "Send the run as multipart/form-data with a 'run' field (JSON) and optional 'attachments' files." }]);
  }
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
