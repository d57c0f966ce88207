/**
 * Load test of POST /api/v1/sweeps (`npm run bench:api`). Needs a running app at APP_BASE_URL and the app's database
 * env (DB_*): it makes a throwaway API token for the demo developer, sends a 241 × 121 sweep of two double-shell
 * particles from 16 connections for about 10 s with autocannon, prints p50/p95/p99 latency and the error count, and
 * appends a row to bench/api-results.md. Start the app with a high RATE_LIMIT_PER_MINUTE (e.g. 1000000), or the
 * limiter will answer 429 and the run counts them as errors. BENCH_FORMATS (default "json,arrow") picks the answer
 * formats measured, one run each: JSON, and Apache Arrow IPC (Accept: application/vnd.apache.arrow.stream).
 */
import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import { execSync } from "node:child_process";
import { createRequire } from "node:module";
import { tableFromIPC } from "apache-arrow";
import { db } from "../db/knex";
import { buildParticle, PARTICLE_PRESETS } from "../lib/dielectric";
import { createToken, revokeToken } from "../lib/tokens/service";
import { findActiveUserByEmail, findUserById } from "../lib/users/repo";

/** The part of autocannon's API used here (the package ships no type declarations). */
interface AutocannonRun extends PromiseLike<{ errors: number; timeouts: number }> {
  on(event: "response", listener: (client: unknown, status: number, bytes: number, ms: number) => void): void;
}
type Autocannon = (opts: Record<string, unknown>) => AutocannonRun;
const autocannon = createRequire(import.meta.url)("autocannon") as Autocannon;

const BASE = (process.env.APP_BASE_URL ?? "").replace(/\/$/, "");
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 16);
const DURATION_S = Number(process.env.BENCH_SECONDS ?? 10);
const DEVELOPER = process.env.BENCH_USER_EMAIL ?? "dana.dev@example.test";
const RESULTS = "bench/api-results.md";
const TARGET_P95_MS = 100;
const ARROW = "application/vnd.apache.arrow.stream";
const FORMATS = (process.env.BENCH_FORMATS ?? "json,arrow").split(",").map((f) => f.trim()) as ("json" | "arrow")[];
const FORMAT_SECTION = "## JSON and Arrow answers";

const body = JSON.stringify({
  mediumPermittivity: 78.3,
  frequencies: { start: 1e3, stop: 1e9, points: 241 },
  conductivities: { start: 1e-4, stop: 1, points: 121 },
  particles: [
    buildParticle("yeast-viable", PARTICLE_PRESETS.yeastViable.model),
    buildParticle("yeast-heat-killed", PARTICLE_PRESETS.yeastHeatKilled.model),
  ],
});

/** Exact percentile of sorted values (nearest rank). @example percentile([1, 2, 3, 4], 50) // → 2 */
function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

async function makeToken(): Promise<{ id: number; secret: string; userId: number }> {
  const user = await findActiveUserByEmail(DEVELOPER);
  if (!user) throw new Error(`No active user ${DEVELOPER} in database ${process.env.DB_NAME}; seed it or set BENCH_USER_EMAIL.`);
  const { id, secret } = await createToken(user, { label: `bench-api ${new Date().toISOString()}` });
  return { id, secret, userId: user.id };
}

async function checkOnce(url: string, headers: Record<string, string>): Promise<void> {
  const res = await fetch(url, { method: "POST", headers, body });
  const bytes = new Uint8Array(await res.arrayBuffer());
  if (res.status !== 200) throw new Error(`Warm-up request answered ${res.status}: ${new TextDecoder().decode(bytes).slice(0, 300)}`);
  if (headers.accept === ARROW) {
    const table = tableFromIPC(bytes);
    if (table.numRows !== 241 * 121 || table.numCols !== 4) throw new Error("Warm-up Arrow answer has the wrong shape");
    return;
  }
  const json = JSON.parse(new TextDecoder().decode(bytes)) as { particles: { re: number[] }[] };
  if (json.particles.length !== 2 || json.particles[0].re.length !== 241 * 121) throw new Error("Warm-up answer has the wrong shape");
}

function commit(): string {
  try {
    return execSync("git rev-parse --short HEAD", { encoding: "utf8" }).trim();
  } catch {
    return "unknown";
  }
}

async function main(): Promise<void> {
  if (!BASE) throw new Error("Set APP_BASE_URL to the running app, e.g. http://127.0.0.1:3000");
  const token = await makeToken();
  try {
    for (const format of FORMATS) await runFormat(format, token.secret);
  } finally {
    const user = (await findUserById(token.userId))!;
    await revokeToken(user, token.id);
    await db.destroy();
  }
}

async function runFormat(format: "json" | "arrow", secret: string): Promise<void> {
  const url = `${BASE}/api/v1/sweeps`;
  const headers = { authorization: `Bearer ${secret}`, "content-type": "application/json", accept: format === "arrow" ? ARROW : "application/json" };
  {
    for (let i = 0; i < 5; i++) await checkOnce(url, headers);
    const latencies: number[] = [];
    const phases = ["app", "read", "compute", "serialize"] as const;
    const server: Record<(typeof phases)[number], number[]> = { app: [], read: [], compute: [], serialize: [] };
    const statuses = new Map<number, number>();
    const instance = autocannon({
      url,
      connections: CONNECTIONS,
      duration: DURATION_S,
      timeout: 10,
      requests: [
        {
          method: "POST",
          headers,
          body,
          onResponse: (_status: number, _body: string, _ctx: unknown, hdrs: Record<string, string>) => {
            for (const phase of phases) {
              const m = new RegExp(`${phase};dur=([\\d.]+)`).exec(hdrs["server-timing"] ?? "");
              if (m) server[phase].push(Number(m[1]));
            }
          },
        },
      ],
    });
    instance.on("response", (_client, status, _bytes, ms) => {
      latencies.push(ms);
      statuses.set(status, (statuses.get(status) ?? 0) + 1);
    });
    const result = await instance;
    latencies.sort((a, b) => a - b);
    for (const phase of phases) server[phase].sort((a, b) => a - b);
    const serverMs = server.app;
    const non2xx = [...statuses].filter(([s]) => s < 200 || s >= 300).reduce((n, [, c]) => n + c, 0);
    const errors = result.errors + result.timeouts + non2xx;
    const f = (v: number) => v.toFixed(1);
    const phaseNote = (["read", "compute", "serialize"] as const).map((p) => `${p} ${f(percentile(server[p], 50))}`).join(", ");
    const fig = {
      requests: latencies.length,
      rps: latencies.length / DURATION_S,
      p50: percentile(latencies, 50),
      p95: percentile(latencies, 95),
      p99: percentile(latencies, 99),
      s50: percentile(serverMs, 50),
      s95: percentile(serverMs, 95),
      s99: percentile(serverMs, 99),
      errors,
    };
    console.log(`POST /api/v1/sweeps (${format}), 241 × 121, 2 double-shell particles, ${CONNECTIONS} connections, ${DURATION_S} s`);
    console.log(`  ${fig.requests} responses (${f(fig.rps)}/s); status counts ${JSON.stringify(Object.fromEntries(statuses))}`);
    console.log(`  latency at the client: p50 ${f(fig.p50)} ms, p95 ${f(fig.p95)} ms, p99 ${f(fig.p99)} ms`);
    console.log(`  server time (Server-Timing app;dur): p50 ${f(fig.s50)} ms, p95 ${f(fig.s95)} ms, p99 ${f(fig.s99)} ms`);
    for (const phase of ["read", "compute", "serialize"] as const) {
      const v = server[phase];
      console.log(`    ${phase}: p50 ${f(percentile(v, 50))} ms, p95 ${f(percentile(v, 95))} ms`);
    }
    console.log(`  errors (connection errors + timeouts + non-2xx): ${errors}`);
    console.log(`  target p95 ≤ ${TARGET_P95_MS} ms with 0 errors: ${fig.p95 <= TARGET_P95_MS && errors === 0 ? "met" : "NOT MET"} (client latency)`);
    mkdirSync("bench", { recursive: true });
    if (!existsSync(RESULTS)) {
      writeFileSync(
        RESULTS,
        [
          "# API benchmark: POST /api/v1/sweeps",
          "",
          "Written by `npm run bench:api` (scripts/bench-api.ts) against a running `next start`: 241 frequencies × 121",
          "conductivities × 2 double-shell particles (the engine bench's yeast presets), autocannon with 16 connections for",
          "~10 s on loopback, with a bearer token. Client latency includes queueing behind the other connections; server",
          "time is the route's own Server-Timing figure `app` (authentication, token lookup and rate-limit count in MariaDB,",
          "reading the body, validation and computation, JSON serialisation), split into the phases read / compute /",
          "serialize. Target: p95 ≤ 100 ms, 0 errors. Load generator and server share the machine; the last column is the",
          "machine's 1-minute load average when the run ended (other work on the machine inflates every figure).",
          "",
          "| date (UTC) | commit | engine | machine | conns × s | responses | req/s | client p50 / p95 / p99 (ms) | server p50 / p95 / p99 (ms) | server p50 by phase (ms) | errors | load avg (1 min) at end |",
          "|---|---|---|---|---|---|---|---|---|---|---|---|",
          "",
        ].join("\n"),
      );
    }
    const machine = `${os.cpus().length}× ${os.cpus()[0]?.model.trim() ?? "cpu"}, Node ${process.version}`;
    if (!readFileSync(RESULTS, "utf8").includes(FORMAT_SECTION)) {
      appendFileSync(
        RESULTS,
        [
          "",
          FORMAT_SECTION,
          "",
          "From here on each run measures the JSON answer and the Apache Arrow IPC answer (Accept:",
          "application/vnd.apache.arrow.stream) one after the other; `app processes` is how many app processes served it.",
          "",
          "| date (UTC) | commit | format | app processes | conns × s | responses | req/s | client p50 / p95 / p99 (ms) | server p50 / p95 / p99 (ms) | server p50 by phase (ms) | errors | load avg (1 min) at end |",
          "|---|---|---|---|---|---|---|---|---|---|---|---|",
          "",
        ].join("\n"),
      );
    }
    appendFileSync(
      RESULTS,
      `| ${new Date().toISOString().slice(0, 16).replace("T", " ")} | ${commit()} | ${format} | ${process.env.BENCH_APP_PROCESSES ?? "?"} | ${CONNECTIONS} × ${DURATION_S} | ${fig.requests} | ${f(fig.rps)} | ${f(fig.p50)} / ${f(fig.p95)} / ${f(fig.p99)} | ${f(fig.s50)} / ${f(fig.s95)} / ${f(fig.s99)} | ${phaseNote} | ${errors} | ${os.loadavg()[0].toFixed(1)} |\n`,
    );
    console.log(`  appended to ${RESULTS} (${machine})`);
  }
}

main().catch(async (err) => {
  console.error((err as Error).message);
  await db.destroy().catch(() => undefined);
  process.exit(1);
});
