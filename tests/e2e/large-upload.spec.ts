import { expect, test } from "./support/test";
import { db } from "@/db/knex";
import { insertBenchVersion } from "@/tests/support/bench-fixture";
import { DEMO, signIn } from "./support/auth";
import { releaseDb } from "./support/db";

test.afterAll(async () => {
  await releaseDb();
});

/**
 * The proxy (security headers, action-body check) runs on every route, and Next copies a proxied request's body up to
 * experimental.proxyClientMaxBodySize (10 MB unless set), passing only that much on. A run with attachments may be up
 * to 5 × 10 MiB + 1 MiB, so an attachment over 10 MB must arrive whole, byte for byte.
 */
test("a run with 12 MiB of attachments posted through the running server arrives whole", async ({ page }) => {
  test.setTimeout(120_000);
  const code = `BIG-${Date.now().toString(36).toUpperCase()}`;
  const { versionId } = await insertBenchVersion(db, { code, state: "approved", title: "Large attachment check" });
  await signIn(page, DEMO.technician);

  // Two images of 6 MiB each (each under the 10 MiB per-file cap), 12 MiB of body in all.
  const size = 6 * 1024 * 1024;
  const images = [7, 9].map((fill) => {
    const png = Buffer.alloc(size, fill);
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]).copy(png);
    return png;
  });
  const run = { versionId, bufferLot: "B-big", conductivityUsPerCm: "98", measuredAtC: "24", operatingTemperatureC: "22", frequencyKHz: "350", voltageVpp: "14.1" };
  const form = new FormData();
  form.set("run", JSON.stringify(run));
  images.forEach((png, i) => form.append("attachments", new File([new Uint8Array(png)], `gate-${i + 1}.png`, { type: "image/png" })));
  const res = await page.request.post("/api/v1/runs", { headers: { origin: new URL(page.url()).origin }, multipart: form, timeout: 90_000 });
  expect(res.status(), await res.text()).toBe(201);
  const { run: saved } = await res.json();
  expect(saved.attachments).toHaveLength(2);
  for (const [i, png] of images.entries()) {
    const file = await page.request.get(`/api/v1/runs/attachments/${saved.attachments[i].id}`, { timeout: 90_000 });
    expect(file.status()).toBe(200);
    expect((await file.body()).equals(png)).toBe(true);
  }
});
