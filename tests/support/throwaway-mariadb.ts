import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import net from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";

/**
 * A MariaDB of the test's own (own data folder, free loopback port) that the test may stop and start at will without
 * touching the tier's shared database. About 1 s to initialise and start.
 */
export interface ThrowawayMariaDb {
  port: number;
  env: { DB_HOST: string; DB_PORT: string; DB_USER: string; DB_PASSWORD: string; DB_NAME: string };
  start: () => Promise<void>;
  stop: () => Promise<void>;
  remove: () => Promise<void>;
}

const SBIN = ["/usr/sbin", "/usr/bin"].join(":");

async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const port = (server.address() as net.AddressInfo).port;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

async function until(check: () => boolean, ms: number, what: string): Promise<void> {
  const end = Date.now() + ms;
  while (!check()) {
    if (Date.now() > end) throw new Error(`Throwaway MariaDB: ${what} did not happen within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Initialises and starts a throwaway MariaDB with database `sw_outage` and user `sw_outage`. */
export async function startThrowawayMariaDb(): Promise<ThrowawayMariaDb> {
  const dir = mkdtempSync(path.join(tmpdir(), "sw-outage-db-"));
  const port = await freePort();
  const sock = path.join(dir, "mariadb.sock");
  const env = { ...process.env, PATH: `${process.env.PATH}:${SBIN}` };
  const user = spawnSync("id", ["-un"], { encoding: "utf8" }).stdout.trim();
  const init = spawnSync("mariadb-install-db", ["--no-defaults", `--datadir=${dir}/data`, `--user=${user}`, "--auth-root-authentication-method=socket", "--skip-test-db"], { env, encoding: "utf8" });
  if (init.status !== 0) throw new Error(`mariadb-install-db failed: ${init.stderr.slice(-500)}`);
  let proc: ChildProcess | null = null;
  const ping = () => spawnSync("mariadb-admin", ["--no-defaults", `--socket=${sock}`, "-uroot", "ping"], { env }).status === 0;
  const db: ThrowawayMariaDb = {
    port,
    env: { DB_HOST: "127.0.0.1", DB_PORT: String(port), DB_USER: "sw_outage", DB_PASSWORD: "sw-outage-pass", DB_NAME: "sw_outage" },
    async start() {
      proc = spawn("mariadbd", ["--no-defaults", `--user=${user}`, `--datadir=${dir}/data`, "--bind-address=127.0.0.1", `--port=${port}`, `--socket=${sock}`, `--pid-file=${dir}/mariadb.pid`, `--log-error=${dir}/mariadb.err`, "--skip-name-resolve", "--character-set-server=utf8mb4", "--collation-server=utf8mb4_unicode_ci"], { env, stdio: "ignore" });
      await until(ping, 30_000, "start");
    },
    async stop() {
      const p = proc;
      proc = null;
      if (!p || p.exitCode !== null) return;
      const exited = new Promise((r) => p.once("exit", r));
      p.kill("SIGTERM");
      await exited;
    },
    async remove() {
      await db.stop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
  await db.start();
  const sql = `CREATE DATABASE sw_outage CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
CREATE USER 'sw_outage'@'127.0.0.1' IDENTIFIED BY 'sw-outage-pass'; GRANT ALL PRIVILEGES ON sw_outage.* TO 'sw_outage'@'127.0.0.1'; FLUSH PRIVILEGES;`;
  const made = spawnSync("mariadb", ["--no-defaults", `--socket=${sock}`, "-uroot", "-e", sql], { env, encoding: "utf8" });
  if (made.status !== 0) throw new Error(`creating the throwaway database failed: ${made.stderr}`);
  return db;
}
