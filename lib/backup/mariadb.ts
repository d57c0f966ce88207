import { spawn } from "node:child_process";
import { createReadStream, createWriteStream } from "node:fs";
import { pipeline } from "node:stream/promises";
import { dbCredentials } from "@/db/config";
import { readEnv } from "@/lib/env";

/**
 * How the backup tools reach MariaDB: DB_BACKUP_USER / DB_BACKUP_PASSWORD when set, else the migrator account
 * (DB_MIGRATOR_USER; the app account may not read triggers nor recreate tables).
 */
export interface DumpTarget {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
}

/**
 * The database the backup commands work on, from the environment.
 * @example dumpTarget().database // "sievewright"
 */
export function dumpTarget(env: NodeJS.ProcessEnv = process.env): DumpTarget {
  const e = readEnv(env);
  return {
    host: e.DB_HOST,
    port: e.DB_PORT,
    ...(e.DB_BACKUP_USER ? { user: e.DB_BACKUP_USER, password: e.DB_BACKUP_PASSWORD ?? "" } : dbCredentials("migrator", env)),
    database: e.DB_NAME,
  };
}

const connectionArgs = (t: DumpTarget) => ["--no-defaults", `--host=${t.host}`, `--port=${t.port}`, `--user=${t.user}`, "--protocol=TCP"];

function run(command: string, args: string[], t: DumpTarget, io: { stdin?: string; stdout?: string }): Promise<void> {
  return new Promise((resolve, reject) => {
    // The password goes through the environment (MYSQL_PWD), never the command line where `ps` would show it.
    const child = spawn(command, args, { env: { ...process.env, MYSQL_PWD: t.password }, stdio: ["pipe", "pipe", "pipe"] });
    let stderr = "";
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    const out = io.stdout ? pipeline(child.stdout, createWriteStream(io.stdout)) : Promise.resolve(child.stdout.resume());
    const inp = io.stdin ? pipeline(createReadStream(io.stdin), child.stdin) : Promise.resolve(child.stdin.end());
    child.on("error", (err) => reject(new Error(`${command} could not start (${err.message}); install mariadb-client.`)));
    child.on("close", (code) => {
      Promise.all([out, inp])
        .then(() => (code === 0 ? resolve() : reject(new Error(`${command} exited with ${code}: ${stderr.trim().slice(0, 500)}`))))
        .catch(reject);
    });
  });
}

/**
 * Dumps the whole database (schema, rows, triggers) into a file with mariadb-dump, consistently (one transaction).
 * @example await dumpDatabase(dumpTarget(), "/tmp/backup/database.sql")
 */
export function dumpDatabase(t: DumpTarget, file: string): Promise<void> {
  return run("mariadb-dump", [...connectionArgs(t), "--single-transaction", "--routines", "--triggers", "--hex-blob", "--skip-comments", "--default-character-set=utf8mb4", t.database], t, { stdout: file });
}

/**
 * Loads a dump file into the database with the mariadb client.
 * @example await loadDump(dumpTarget(), "/tmp/restore/database.sql")
 */
export function loadDump(t: DumpTarget, file: string): Promise<void> {
  return run("mariadb", [...connectionArgs(t), "--default-character-set=utf8mb4", t.database], t, { stdin: file });
}
