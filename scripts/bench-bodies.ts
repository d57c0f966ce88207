/**
 * Memory under oversized chunked bodies (`npm run bench:bodies`, run by hand). Needs a running app at APP_BASE_URL,
 * the app's database env (DB_*) and the PIDs of the app's server processes in BENCH_PIDS (comma-separated; with
 * `npm start`, every worker). It makes a throwaway API token for the demo developer, sends BENCH_BODIES (4) parallel
 * chunked bodies of BENCH_BODY_MB (450) MB each — no Content-Length — to POST /api/v1/sweeps, samples the summed RSS of
 * the server processes every 100 ms from /proc, and appends a row to bench/bodies-results.md: RSS before, peak, and
 * 5 s after, the statuses the bodies got and how many bytes the client managed to send before the server answered.
 */
import { appendFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import { execSync } from "node:child_process";
import { db } from "../db/knex";
import { createToken, revokeToken } from "../lib/tokens/service";
import { findActiveUserByEmail } from "../lib/users/repo";

const BASE = new URL(process.env.APP_BASE_URL ?? "http://127.0.0.1:3000");
const PIDS = (process.env.BENCH_PIDS ?? "").split(",").map(Number).filter((n) => n > 0);
const BODIES = Number(process.env.BENCH_BODIES ?? 4);
const BODY_MB = Number(process.env.BENCH_BODY_MB ?? 450);
const RESULTS = "bench/bodies-results.md";
const MiB = 1024 * 1024;

function rssMiB(): number {
  let kib = 0;
  for (const pid of PIDS) {
    const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
    kib += m ? Number(m[1]) : 0;
  }
  return kib / 1024;
}

/** Streams `mb` MiB of JSON-ish bytes without Content-Length; resolves with the status and the bytes written. */
function sendChunked(token: string, mb: number): Promise<{ status: number | string; sentMiB: number }> {
  return new Promise((resolve) => {
    const chunk = Buffer.alloc(MiB, 0x20);
    let sent = 0;
    let status: number | string = "no answer";
    const req = http.request(
      { host: BASE.hostname, port: BASE.port, path: "/api/v1/sweeps", method: "POST", headers: { authorization: `Bearer ${token}`, "content-type": "application/json", "transfer-encoding": "chunked" } },
      (res) => {
        status = res.statusCode ?? "none";
        res.resume();
        res.on("end", () => {
          req.destroy();
          resolve({ status, sentMiB: sent / MiB });
        });
      },
    );
    req.on("error", (err) => resolve({ status: status === "no answer" ? `error ${(err as NodeJS.ErrnoException).code ?? err.message}` : status, sentMiB: sent / MiB }));
    const pump = () => {
      while (sent < mb * MiB) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once("drain", pump);
      }
      req.end();
    };
    pump();
  });
}

async function main(): Promise<void> {
  if (PIDS.length === 0) throw new Error("Set BENCH_PIDS to the app server's PID(s), e.g. BENCH_PIDS=$(pgrep -d, -f next-server)");
  const user = await findActiveUserByEmail(process.env.BENCH_USER_EMAIL ?? "dana.dev@example.test");
  if (!user) throw new Error("No demo developer in the database; seed it or set BENCH_USER_EMAIL.");
  const token = await createToken(user, { label: `bench-bodies ${new Date().toISOString()}` });
  try {
    const before = rssMiB();
    let peak = before;
    const sampler = setInterval(() => (peak = Math.max(peak, rssMiB())), 100);
    const t0 = Date.now();
    const results = await Promise.all(Array.from({ length: BODIES }, () => sendChunked(token.secret, BODY_MB)));
    const seconds = (Date.now() - t0) / 1000;
    await new Promise((r) => setTimeout(r, 5_000));
    clearInterval(sampler);
    const after = rssMiB();
    const statuses = results.map((r) => r.status).join(", ");
    const sent = results.map((r) => r.sentMiB.toFixed(0)).join(", ");
    console.log(`${BODIES} × ${BODY_MB} MiB chunked to /api/v1/sweeps in ${seconds.toFixed(1)} s: statuses ${statuses}; MiB sent before the answer ${sent}`);
    console.log(`server RSS (MiB, ${PIDS.length} process(es)): before ${before.toFixed(0)}, peak ${peak.toFixed(0)}, 5 s after ${after.toFixed(0)}`);
    mkdirSync("bench", { recursive: true });
    if (!existsSync(RESULTS)) {
      writeFileSync(RESULTS, [
        "# Oversized chunked bodies: server memory",
        "",
        "Written by `npm run bench:bodies` (scripts/bench-bodies.ts) against a running app: parallel request bodies without",
        "Content-Length to POST /api/v1/sweeps (cap 2 MiB), summed RSS of the server processes sampled every 100 ms.",
        "Before the streamed caps (lib/http/body.ts) four 450 MB bodies took the server from 1.4 to 3.7 GB.",
        "",
        "| date (UTC) | commit | bodies × MiB | statuses | MiB the client sent before the answer | RSS before / peak / 5 s after (MiB) | processes |",
        "|---|---|---|---|---|---|---|",
        "",
      ].join("\n"));
    }
    const commit = execSync("git rev-parse --short HEAD", { encoding: "utf8" }).trim();
    appendFileSync(RESULTS, `| ${new Date().toISOString().slice(0, 16).replace("T", " ")} | ${commit} | ${BODIES} × ${BODY_MB} | ${statuses} | ${sent} | ${before.toFixed(0)} / ${peak.toFixed(0)} / ${after.toFixed(0)} | ${PIDS.length} |\n`);
    console.log(`appended to ${RESULTS}`);
  } finally {
    await revokeToken(user, token.id);
    await db.destroy();
  }
}

main().catch(async (err) => {
  console.error((err as Error).message);
  await db.destroy().catch(() => undefined);
  process.exit(1);
});
