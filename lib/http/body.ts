/**
 * Request bodies with a size cap that holds while streaming: a declared Content-Length over the cap is refused before
 * a byte is read, and a body without one (chunked) is counted as it arrives and abandoned the moment it passes the cap.
 * Nothing over the cap is ever held in memory. Over the cap → TooLargeError (413) with the limit in words.
 */
import { InputError, TooLargeError } from "@/lib/errors";
import { formatFileSize } from "@/lib/units/size";

/** Largest JSON body the API reads by default: 2 MiB. */
export const MAX_JSON_BYTES = 2 * 1024 * 1024;


function tooLarge(maxBytes: number, what: string, declared?: number): TooLargeError {
  const size = declared === undefined ? "over" : `${formatFileSize(declared)}; that is over`;
  return new TooLargeError(`The ${what} is ${size} the limit of ${formatFileSize(maxBytes)} (${maxBytes} bytes); nothing was read or stored.`);
}

/**
 * Refuses a request whose Content-Length header already says it is over `maxBytes` (no body is read).
 * @example checkDeclaredLength(req, 2 * 1024 * 1024) // throws TooLargeError for content-length: 5000000
 */
export function checkDeclaredLength(req: Request, maxBytes: number, what = "request body"): void {
  const header = req.headers.get("content-length");
  if (header === null) return;
  const declared = Number(header);
  if (!Number.isFinite(declared) || declared < 0) throw new InputError([{ path: "content-length", message: `The Content-Length header "${header.slice(0, 40)}" is not a byte count.` }]);
  if (declared > maxBytes) throw tooLarge(maxBytes, what, declared);
}

/**
 * Reads the whole body as bytes, never more than `maxBytes` (Content-Length checked first, then counted while streaming).
 * @example const bytes = await readCappedBytes(req, 10 * 1024 * 1024, "upload"); // Uint8Array
 */
export async function readCappedBytes(req: Request, maxBytes: number, what = "request body"): Promise<Uint8Array<ArrayBuffer>> {
  checkDeclaredLength(req, maxBytes, what);
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      chunks.length = 0;
      reader.cancel().catch(() => undefined);
      throw tooLarge(maxBytes, what);
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/**
 * Reads a JSON body with a streaming size cap; bad JSON → InputError (400), too large → TooLargeError (413).
 * @example const body = await readJson(req); // parsed JSON value
 */
export async function readJson(req: Request, maxBytes = MAX_JSON_BYTES): Promise<unknown> {
  const bytes = await readCappedBytes(req, maxBytes, "JSON body");
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new InputError([{ path: "", message: "The body is not valid UTF-8 text; send a JSON object encoded as UTF-8." }]);
  }
  if (!text.trim()) throw new InputError([{ path: "", message: "The request body is empty; send a JSON object." }]);
  try {
    return JSON.parse(text);
  } catch (err) {
    throw new InputError([{ path: "", message: `The body is not valid JSON: ${(err as Error).message}` }]);
  }
}

/**
 * Reads a multipart/form-data body with a streaming size cap, then parses it.
 * @example const form = await readCappedFormData(req, 51 * 1024 * 1024, "upload"); form.get("run")
 */
export async function readCappedFormData(req: Request, maxBytes: number, what = "upload"): Promise<FormData> {
  const type = req.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data;/i.test(type)) {
    throw new InputError([{ path: "content-type", message: `Send the ${what} as multipart/form-data (got "${type.slice(0, 60) || "no content type"}").` }]);
  }
  const bytes = await readCappedBytes(req, maxBytes, what);
  try {
    return await new Response(bytes as Uint8Array<ArrayBuffer>, { headers: { "content-type": type } }).formData();
  } catch {
    throw new InputError([{ path: "", message: `The ${what} is not well-formed multipart/form-data.` }]);
  }
}
