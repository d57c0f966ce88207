import { describe, expect, it } from "vitest";
import { InputError, TooLargeError } from "@/lib/errors";
import { readCappedBytes, readCappedFormData, readJson } from "@/lib/http/body";
import { formatFileSize } from "@/lib/units/size";
import { chunkedBody, chunkedRequest } from "@/tests/support/chunked";

const MiB = 1024 * 1024;

describe("streamed body caps", () => {
  it("refuses a declared Content-Length over the cap without reading a byte", async () => {
    const { stream, pulled } = chunkedBody(10 * MiB);
    const req = chunkedRequest("http://t/x", stream, { "content-length": String(10 * MiB) });
    const err = await readCappedBytes(req, MiB).catch((e) => e);
    expect(err).toBeInstanceOf(TooLargeError);
    expect(err.message).toBe("The request body is 10 MiB; that is over the limit of 1 MiB (1048576 bytes); nothing was read or stored.");
    expect(pulled()).toBeLessThanOrEqual(64 * 1024); // at most what the stream pre-buffers, never the body
  });

  it("stops reading a chunked body as soon as it passes the cap", async () => {
    const { stream, pulled } = chunkedBody(200 * MiB);
    const err = await readJson(chunkedRequest("http://t/x", stream, { "content-type": "application/json" }), 2 * MiB).then(() => null, (e: TooLargeError) => e);
    expect(err).toBeInstanceOf(TooLargeError);
    expect(err?.status).toBe(413);
    expect(err?.message).toMatch(/^The JSON body is over the limit of 2 MiB \(2097152 bytes\)/);
    expect(pulled()).toBeLessThan(3 * MiB);
  });

  it("reads a chunked body under the cap whole", async () => {
    const { stream } = chunkedBody(3 * 64 * 1024 + 7, 64 * 1024, 0x31);
    const bytes = await readCappedBytes(chunkedRequest("http://t/x", stream, {}), MiB);
    expect(bytes.byteLength).toBe(3 * 64 * 1024 + 7);
    expect(bytes.every((b) => b === 0x31)).toBe(true);
  });

  it("answers bad JSON, bad UTF-8 and an empty body with a 400 InputError", async () => {
    const post = (body: BodyInit) => new Request("http://t/x", { method: "POST", body });
    await expect(readJson(post("{oops"))).rejects.toThrow(/not valid JSON/);
    await expect(readJson(post(new Uint8Array([0x7b, 0xff, 0xfe, 0x7d])))).rejects.toThrow(/not valid UTF-8/);
    await expect(readJson(post("   "))).rejects.toBeInstanceOf(InputError);
    const bad = new Request("http://t/x", { method: "POST", body: "{}", headers: { "content-length": "lots" } });
    await expect(readCappedBytes(bad, MiB)).rejects.toThrow(/Content-Length header "lots" is not a byte count/);
  });

  it("parses multipart under the cap and refuses other content types", async () => {
    const form = new FormData();
    form.set("run", '{"a":1}');
    const parsed = await readCappedFormData(new Request("http://t/x", { method: "POST", body: form }), MiB);
    expect(parsed.get("run")).toBe('{"a":1}');
    await expect(readCappedFormData(new Request("http://t/x", { method: "POST", body: "x", headers: { "content-type": "text/plain" } }), MiB)).rejects.toThrow(/multipart\/form-data/);
  });

  it("describes sizes in words", () => {
    expect([formatFileSize(512), formatFileSize(1536), formatFileSize(40 * MiB)]).toEqual(["512 bytes", "1.5 KiB", "40 MiB"]);
  });
});
