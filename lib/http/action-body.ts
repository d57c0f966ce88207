import { TooLargeError } from "@/lib/errors";
import { formatFileSize as describeBytes } from "@/lib/units/size";
import { readCappedBytes } from "./body";

/**
 * Server-action requests checked before Next.js decodes them. Next answers 500 to a fetch action whose body is over
 * its size limit or cannot be decoded; the proxy calls this first so such requests get 413 or 400 with a sentence.
 * A fetch action is a POST with a `Next-Action` header whose body is React's encoding of the argument list: JSON of
 * an array as text, or multipart form data whose field "0" holds that JSON.
 */

/** Largest server-action body: 1 MiB, the same as `serverActions.bodySizeLimit` in next.config.mjs. */
export const MAX_ACTION_BODY_BYTES = 1024 * 1024;

function refusal(status: 400 | 413, message: string): Response {
  return Response.json({ error: status === 413 ? "too_large" : "bad_request", message }, { status });
}

function isArgumentList(json: string): boolean {
  try {
    return Array.isArray(JSON.parse(json));
  } catch {
    return false;
  }
}

/**
 * For a server-action POST: a 413 when the body is over `maxBytes` (declared or counted while reading), a 400 when it
 * is not an argument list Next can decode; null when the request is not an action call or its body is well formed.
 * Reads the request's body (the proxy gets its own copy; Next keeps another for the action).
 * @example const refused = await checkActionBody(req); if (refused) return refused;
 */
export async function checkActionBody(req: Request, maxBytes = MAX_ACTION_BODY_BYTES): Promise<Response | null> {
  if (req.method !== "POST" || !req.headers.has("next-action")) return null;
  const limit = `the limit for a form submission is ${describeBytes(maxBytes)}`;
  const declared = Number(req.headers.get("content-length") ?? NaN);
  if (declared > maxBytes) return refusal(413, `The form data is ${describeBytes(declared)}; ${limit}. Nothing was saved.`);
  let bytes: Uint8Array<ArrayBuffer>;
  try {
    bytes = await readCappedBytes(req, maxBytes, "form data");
  } catch (error) {
    if (error instanceof TooLargeError) return refusal(413, `The form data is larger than ${describeBytes(maxBytes)}; ${limit}. Nothing was saved.`);
    throw error;
  }
  // The multipart boundary is case-sensitive: only the media type is compared without case.
  const type = req.headers.get("content-type") ?? "";
  if (type.toLowerCase().startsWith("multipart/form-data")) {
    let root: FormDataEntryValue | null = null;
    try {
      root = (await new Response(bytes, { headers: { "content-type": type } }).formData()).get("0");
    } catch {
      return refusal(400, "The form data could not be read (malformed multipart body). Nothing was saved; reload the page and try again.");
    }
    if (typeof root !== "string" || !isArgumentList(root)) return refusal(400, "The form data has no argument list in field \"0\". Nothing was saved; reload the page and try again.");
    return null;
  }
  if (!isArgumentList(new TextDecoder().decode(bytes))) return refusal(400, "The form data is not an argument list (JSON array). Nothing was saved; reload the page and try again.");
  return null;
}
