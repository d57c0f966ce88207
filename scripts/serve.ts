/**
 * `npm start`'s app server: one Next.js production server per core with Node's cluster module. The primary forks
 * APP_WORKERS workers (default: the number of cores; "1" gives a single process), all listening on APP_PORT on
 * loopback — the operating system spreads connections among them. Sessions are JWTs and every shared state (rate-limit
 * windows, sign-in attempts, outbox claims, optimistic locks) lives in MariaDB, so workers need nothing from each other.
 * A worker that dies is replaced (at most 5 times a minute); SIGINT/SIGTERM stop every worker, then the primary.
 */
import cluster from "node:cluster";
import os from "node:os";
import path from "node:path";

const port = process.env.APP_PORT ?? "3000";
const host = process.env.APP_HOST ?? "127.0.0.1";

/**
 * Number of app processes from APP_WORKERS ("auto" or empty → cores).
 * @example workerCount("3") // 3
 */
function workerCount(raw = process.env.APP_WORKERS ?? ""): number {
  const cores = os.availableParallelism();
  if (raw === "" || raw === "auto") return cores;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 1 || n > 64) throw new Error(`APP_WORKERS must be "auto" or a whole number from 1 to 64; got "${raw}".`);
  return n;
}

async function runWorker(): Promise<void> {
  process.argv = [process.argv[0], path.resolve("node_modules/next/dist/bin/next"), "start", "-p", port, "-H", host];
  await import("next/dist/bin/next");
}

function runPrimary(): void {
  const count = workerCount();
  let stopping = false;
  const restarts: number[] = [];
  console.log(`[serve] ${count} app process(es) on http://${host}:${port} (APP_WORKERS=${process.env.APP_WORKERS || "auto"})`);
  for (let i = 0; i < count; i++) cluster.fork();
  cluster.on("online", (w) => console.log(`[serve] worker ${w.id} (pid ${w.process.pid}) started`));
  cluster.on("exit", (w, code, signal) => {
    if (stopping) return;
    console.error(`[serve] worker ${w.id} (pid ${w.process.pid}) exited (${signal ?? code}); starting a new one`);
    const now = Date.now();
    restarts.push(now);
    while (restarts.length && restarts[0] < now - 60_000) restarts.shift();
    if (restarts.length > 5) {
      console.error("[serve] workers keep dying (more than 5 in a minute); stopping. See the errors above.");
      stop(1);
      return;
    }
    cluster.fork();
  });
  const stop = (code = 0) => {
    if (stopping) return;
    stopping = true;
    const workers = Object.values(cluster.workers ?? {});
    let left = workers.length;
    if (left === 0) process.exit(code);
    const force = setTimeout(() => process.exit(code), 10_000);
    for (const w of workers) {
      w?.once("exit", () => {
        if (--left === 0) {
          clearTimeout(force);
          process.exit(code);
        }
      });
      w?.process.kill("SIGTERM");
    }
  };
  process.on("SIGINT", () => stop(0));
  process.on("SIGTERM", () => stop(0));
}

if (cluster.isPrimary) runPrimary();
else void runWorker();
