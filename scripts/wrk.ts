/**
 * Runs wrk (Debian's `wrk` package, a load generator written in C) for `npm run load`: a second client beside
 * autocannon for the scenarios whose answers are large (autocannon parses every answer in JavaScript on one core of
 * the two the server also needs), and a background load that does not share the measuring client's event loop.
 */
import { spawn, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

/** What one wrk run measured: latencies at the client in ms, and the client's own CPU time. */
export interface WrkFigures {
  responses: number;
  seconds: number;
  /** Mean latency, ms. */
  mean: number;
  p50: number;
  p95: number;
  p99: number;
  /** Responses with a status other than 2xx/3xx. */
  badStatus: number;
  /** Connect, read, write and time-out errors. */
  errors: number;
  /** User + system CPU time of the wrk process, ms. */
  clientCpuMs: number;
}

/** One wrk scenario: a fixed request sent over `connections` connections for `seconds` seconds. */
export interface WrkRequest {
  url: string;
  method?: string;
  headers?: Record<string, string>;
  body?: string;
  connections: number;
  seconds: number;
  /** wrk threads (default 2, at most `connections`). */
  threads?: number;
  /**
   * Mean think time per connection, ms: after each answer a connection waits an exponentially distributed time with
   * this mean before it sends again, so the requests arrive spread out at about connections × 1000 / thinkMs per
   * second rather than back to back (or in a burst at the start of each second).
   */
  thinkMs?: number;
}

/**
 * True when the `wrk` command is installed.
 * @example hasWrk() // true after `apt-get install wrk`
 */
export function hasWrk(): boolean {
  return spawnSync("wrk", ["--version"], { encoding: "utf8" }).error === undefined;
}

const luaString = (s: string) => `"${s.replace(/\\/g, "\\\\").replace(/"/g, '\\"').replace(/\n/g, "\\n")}"`;

/**
 * The Lua script that sets the request and prints the summary as one JSON line (latencies from wrk in µs).
 * @example wrkScript({ url: "http://x/", connections: 1, seconds: 1 }, "/tmp/body") // 'wrk.method = "GET"…'
 */
export function wrkScript(req: WrkRequest, bodyFile: string | null): string {
  const lines = [`wrk.method = ${luaString(req.method ?? "GET")}`];
  if (bodyFile) lines.push(`local f = io.open(${luaString(bodyFile)}, "rb"); wrk.body = f:read("*a"); f:close()`);
  for (const [k, v] of Object.entries(req.headers ?? {})) lines.push(`wrk.headers[${luaString(k)}] = ${luaString(v)}`);
  if (req.thinkMs !== undefined) {
    lines.push(
      "local seeded = false",
      `delay = function()`,
      "  if not seeded then math.randomseed(os.time() + (tonumber(tostring({}):match('0x(%x+)') or '0', 16) % 1000003)); seeded = true end",
      `  return -math.log(1 - math.random()) * ${Number(req.thinkMs)}`,
      "end",
    );
  }
  lines.push(
    "done = function(s, latency, requests)",
    '  local e = s.errors.connect + s.errors.read + s.errors.write + s.errors.timeout',
    '  io.write(string.format("WRKJSON {\\"responses\\":%d,\\"us\\":%d,\\"mean\\":%d,\\"p50\\":%d,\\"p95\\":%d,\\"p99\\":%d,\\"bad\\":%d,\\"errors\\":%d}\\n",',
    "    s.requests, s.duration, latency.mean, latency:percentile(50), latency:percentile(95), latency:percentile(99), s.errors.status, e))",
    "end",
  );
  return lines.join("\n") + "\n";
}

/**
 * Parses bash's `times` output (shell, then children: "0m0.130s 0m0.850s") into the children's CPU ms.
 * @example childrenCpuMs("0m0.001s 0m0.002s\n0m0.130s 0m0.850s\n") // 980
 */
export function childrenCpuMs(times: string): number {
  const lines = times.trim().split("\n").filter((l) => /^\d+m[\d.]+s \d+m[\d.]+s$/.test(l.trim()));
  const last = lines[lines.length - 1];
  if (!last) return NaN;
  return last.trim().split(" ").reduce((ms, part) => {
    const [, m, s] = /^(\d+)m([\d.]+)s$/.exec(part) ?? [];
    return ms + (Number(m) * 60 + Number(s)) * 1000;
  }, 0);
}

/**
 * Runs wrk once and resolves with its figures; rejects when wrk fails or prints no summary.
 * @example await runWrk({ url: "http://127.0.0.1:3000/api/auth/session", connections: 16, seconds: 30 })
 */
export function runWrk(req: WrkRequest): Promise<WrkFigures> {
  const dir = mkdtempSync(join(tmpdir(), "sievewright-wrk-"));
  let bodyFile: string | null = null;
  if (req.body !== undefined) {
    bodyFile = join(dir, "body");
    writeFileSync(bodyFile, req.body);
  }
  const script = join(dir, "run.lua");
  writeFileSync(script, wrkScript(req, bodyFile));
  const threads = Math.max(1, Math.min(req.threads ?? 2, req.connections));
  const args = [`-t${threads}`, `-c${req.connections}`, `-d${req.seconds}s`, "--timeout", "20s", "-s", script, req.url];
  return new Promise((resolve, reject) => {
    const child = spawn("bash", ["-c", 'wrk "$@"; rc=$?; times >&2; exit $rc', "wrk", ...args], { stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    let err = "";
    child.stdout.on("data", (d: Buffer) => (out += d.toString()));
    child.stderr.on("data", (d: Buffer) => (err += d.toString()));
    child.on("close", (code) => {
      rmSync(dir, { recursive: true, force: true });
      const line = out.split("\n").find((l) => l.startsWith("WRKJSON "));
      if (code !== 0 || !line) return reject(new Error(`wrk exited with ${code}: ${(err || out).trim().slice(0, 500)}`));
      const j = JSON.parse(line.slice(8)) as { responses: number; us: number; mean: number; p50: number; p95: number; p99: number; bad: number; errors: number };
      resolve({ responses: j.responses, seconds: j.us / 1e6, mean: j.mean / 1000, p50: j.p50 / 1000, p95: j.p95 / 1000, p99: j.p99 / 1000, badStatus: j.bad, errors: j.errors, clientCpuMs: childrenCpuMs(err) });
    });
  });
}
