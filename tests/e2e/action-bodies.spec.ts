import http from "node:http";
import { expect, test } from "./support/test";

/**
 * Server-action requests that Next.js itself would answer with 500 — a body over the 1 MiB limit (declared or
 * chunked) or one that is not an argument list — get 413 or 400 with a sentence from the proxy, on the running app.
 */

const action = { "next-action": "0000000000000000000000000000000000000000", accept: "text/x-component" };

test("an action body over 1 MiB gets 413 naming the limit", async ({ request }) => {
  const res = await request.post("/login", { headers: { ...action, "content-type": "text/plain;charset=UTF-8" }, data: JSON.stringify(["x".repeat(1_200_000)]) });
  expect(res.status()).toBe(413);
  expect((await res.json()).message).toContain("the limit for a form submission is 1 MiB");
});

test("a chunked action body (no Content-Length) is counted and refused with 413 once past 1 MiB", async ({ baseURL }) => {
  const url = new URL("/login", baseURL);
  const { status, body } = await new Promise<{ status: number; body: string }>((resolve, reject) => {
    const req = http.request({ host: url.hostname, port: url.port, path: url.pathname, method: "POST", headers: { ...action, "content-type": "text/plain;charset=UTF-8", "transfer-encoding": "chunked" } }, (res) => {
      let text = "";
      res.on("data", (c) => (text += c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body: text }));
    });
    req.on("error", reject);
    const chunk = Buffer.alloc(64 * 1024, 0x20);
    for (let i = 0; i < 24; i++) req.write(chunk);
    req.end();
  });
  expect(status).toBe(413);
  expect(JSON.parse(body).message).toContain("larger than 1 MiB");
});

for (const [what, type, data] of [
  ["text that is not JSON", "text/plain;charset=UTF-8", "{not json"],
  ["JSON that is not an argument list", "text/plain;charset=UTF-8", '{"a":1}'],
  ["a malformed multipart body", "multipart/form-data; boundary=xyz", "--xyz\r\nContent-Disposition: form-data; name=\"0\"\r\n\r\n[1]"],
  ["multipart without the argument list", "multipart/form-data; boundary=xyz", "--xyz\r\nContent-Disposition: form-data; name=\"a\"\r\n\r\n1\r\n--xyz--\r\n"],
] as const) {
  test(`an action body of ${what} gets 400, not 500`, async ({ request }) => {
    const res = await request.post("/login", { headers: { ...action, "content-type": type }, data });
    expect(res.status()).toBe(400);
    expect((await res.json()).message).toMatch(/^The form data .*Nothing was saved/);
  });
}

test("a well-formed action body for an unknown action is not a server error", async ({ request }) => {
  const res = await request.post("/login", { headers: { ...action, "content-type": "text/plain;charset=UTF-8" }, data: "[]" });
  expect(res.status()).toBeLessThan(500);
});
