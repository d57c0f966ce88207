import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { childrenCpuMs, hasWrk, runWrk, wrkScript } from "../../../scripts/wrk";

describe("wrkScript", () => {
  it("sets the method, the headers and reads the body from its file", () => {
    const lua = wrkScript({ url: "http://x/", method: "POST", headers: { accept: 'a"b', cookie: "c=1" }, connections: 1, seconds: 1 }, "/tmp/body");
    expect(lua).toContain('wrk.method = "POST"');
    expect(lua).toContain('wrk.headers["accept"] = "a\\"b"');
    expect(lua).toContain('wrk.headers["cookie"] = "c=1"');
    expect(lua).toContain('io.open("/tmp/body", "rb")');
    expect(lua).not.toContain("delay = function");
  });

  it("adds an exponential think time only when asked", () => {
    const lua = wrkScript({ url: "http://x/", connections: 1, seconds: 1, thinkMs: 160 }, null);
    expect(lua).toContain("delay = function");
    expect(lua).toContain("-math.log(1 - math.random()) * 160");
    expect(lua).not.toContain("io.open");
  });
});

describe("childrenCpuMs", () => {
  it("adds user and system time of the children line of bash's `times`", () => {
    expect(childrenCpuMs("0m0.001s 0m0.002s\n0m0.130s 0m0.850s\n")).toBeCloseTo(980, 6);
    expect(childrenCpuMs("0m0.000s 0m0.000s\n1m2.500s 0m0.500s\n")).toBeCloseTo(63_000, 6);
    expect(childrenCpuMs("no times here")).toBeNaN();
  });
});

// The test tier installs wrk (scripts/test.sh), so this runs wherever the suite runs.
describe("runWrk against a local server", () => {
  let server: Server;
  let url = "";
  let bodies: string[] = [];
  beforeAll(async () => {
    server = createServer((req, res) => {
      let body = "";
      req.on("data", (d: Buffer) => (body += d.toString()));
      req.on("end", () => {
        bodies.push(`${req.method} ${req.headers["x-probe"]} ${body}`);
        res.writeHead(req.url === "/fail" ? 503 : 200, { "content-type": "text/plain" }).end("ok");
      });
    });
    await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  it("is installed", () => {
    expect(hasWrk()).toBe(true);
  });

  it("sends the request as given and reports percentiles, counts and its own CPU", async () => {
    bodies = [];
    const w = await runWrk({ url: `${url}/`, method: "POST", headers: { "x-probe": "p1" }, body: '{"a":1}', connections: 2, seconds: 1, threads: 1 });
    expect(w.responses).toBeGreaterThan(10);
    expect(w.badStatus).toBe(0);
    expect(w.errors).toBe(0);
    expect(w.p50).toBeGreaterThan(0);
    expect(w.p95).toBeGreaterThanOrEqual(w.p50);
    expect(w.p99).toBeGreaterThanOrEqual(w.p95);
    expect(w.clientCpuMs).toBeGreaterThan(0);
    expect(new Set(bodies)).toEqual(new Set(['POST p1 {"a":1}']));
  }, 20_000);

  it("counts statuses other than 2xx/3xx", async () => {
    const w = await runWrk({ url: `${url}/fail`, connections: 1, seconds: 1, threads: 1 });
    expect(w.responses).toBeGreaterThan(0);
    expect(w.badStatus).toBe(w.responses);
  }, 20_000);

  it("spreads requests out with the think time: about connections / (think time + latency) per second", async () => {
    // Little's law for a closed loop with think time: rate = connections / (mean think time + mean latency); about
    // 40/s here, against thousands per second without the think time.
    const w = await runWrk({ url: `${url}/`, connections: 4, seconds: 3, threads: 2, thinkMs: 100 });
    const rate = w.responses / w.seconds;
    const expected = (4 * 1000) / (100 + w.mean);
    expect(w.mean).toBeGreaterThan(0);
    expect(rate).toBeGreaterThan(expected * 0.65);
    expect(rate).toBeLessThan(expected * 1.35);
  }, 20_000);
});
