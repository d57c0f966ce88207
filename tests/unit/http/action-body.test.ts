import { describe, expect, it } from "vitest";
import { checkActionBody } from "@/lib/http/action-body";

const url = "http://127.0.0.1:3000/admin/users";

/** A server-action call with a FormData argument, as Chromium sends it: React's "$K1" reference, a mixed-case boundary. */
function formDataCall(): Request {
  const boundary = "----WebKitFormBoundaryQx7TbM2aLkP9wZrE";
  const part = (name: string, value: string) => `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
  const body = part("1_userId", "7") + part("1_active", "false") + part("0", JSON.stringify(["$K1"])) + `--${boundary}--\r\n`;
  return new Request(url, { method: "POST", headers: { "next-action": "40a0", "content-type": `multipart/form-data; boundary=${boundary}` }, body });
}

describe("checkActionBody", () => {
  it("passes a multipart action call whose boundary has capital letters (as Chromium makes them)", async () => {
    expect(await checkActionBody(formDataCall())).toBeNull();
  });

  it("passes a JSON argument list and refuses a body that is not one with 400", async () => {
    const ok = new Request(url, { method: "POST", headers: { "next-action": "40a0", "content-type": "text/plain;charset=UTF-8" }, body: JSON.stringify([{ name: "x" }]) });
    expect(await checkActionBody(ok)).toBeNull();
    const bad = new Request(url, { method: "POST", headers: { "next-action": "40a0", "content-type": "text/plain;charset=UTF-8" }, body: "{not json" });
    expect((await checkActionBody(bad))?.status).toBe(400);
  });

  it("refuses multipart without the argument list in field 0 with 400, and a body over the cap with 413", async () => {
    const form = new FormData();
    form.set("1_userId", "7");
    expect((await checkActionBody(new Request(url, { method: "POST", headers: { "next-action": "40a0" }, body: form })))?.status).toBe(400);
    const big = new Request(url, { method: "POST", headers: { "next-action": "40a0", "content-type": "text/plain" }, body: "[" + "1,".repeat(600_000) + "1]" });
    expect((await checkActionBody(big))?.status).toBe(413);
  });

  it("leaves requests that are not action calls alone", async () => {
    expect(await checkActionBody(new Request(url, { method: "POST", body: "x" }))).toBeNull();
  });
});
