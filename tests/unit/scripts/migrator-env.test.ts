import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync, copyFileSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import nextEnv from "@next/env";
import { assertNoMigratorCredentials } from "@/db/config";
import { loadMigratorEnv } from "@/scripts/env-file";

/**
 * The migrator's database credentials never reach the app (README, "Security"): npm start keeps them in .env.migrator
 * (mode 600), Next.js's own .env loader does not read that file, start.sh launches every app process through
 * WITHOUT_MIGRATOR, and the app refuses to start if they are in its environment anyway.
 */
const ROOT = path.resolve(__dirname, "../../..");
const LIB = path.join(ROOT, "scripts/lib.sh");
let dir = "";

function tempApp(): string {
  dir = mkdtempSync(path.join(tmpdir(), "sw-env-"));
  copyFileSync(path.join(ROOT, ".env.example"), path.join(dir, ".env.example"));
  return dir;
}

/** Runs a bash snippet with scripts/lib.sh sourced and ROOT pointed at `root`; returns stdout. */
function bash(root: string, script: string, env: Record<string, string> = {}): string {
  const clean = Object.fromEntries(Object.entries(process.env).filter(([k]) => !k.startsWith("DB_MIGRATOR_"))) as NodeJS.ProcessEnv;
  return execFileSync("bash", ["-c", `source "${LIB}"; ROOT="${root}"; ${script}`], { env: { ...clean, ...env }, encoding: "utf8" });
}

afterEach(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
  dir = "";
});

describe("start.sh wiring (scripts/lib.sh)", () => {
  it("ensure_env writes .env without the migrator and .env.migrator with a generated password, mode 600", () => {
    const root = tempApp();
    bash(root, "ensure_env >/dev/null");
    const env = readFileSync(path.join(root, ".env"), "utf8");
    const migrator = readFileSync(path.join(root, ".env.migrator"), "utf8");
    expect(env).not.toMatch(/^DB_MIGRATOR_/m);
    expect(env).toMatch(/^NEXTAUTH_SECRET=[A-Za-z0-9_-]{40,}$/m);
    expect(migrator).toMatch(/^DB_MIGRATOR_USER=sievewright_migrator$/m);
    expect(migrator).toMatch(/^DB_MIGRATOR_PASSWORD=[A-Za-z0-9_-]{40,}$/m);
    expect(statSync(path.join(root, ".env.migrator")).mode & 0o777).toBe(0o600);
  });

  it("moves DB_MIGRATOR_* out of an .env written before the split, keeping the password", () => {
    const root = tempApp();
    writeFileSync(path.join(root, ".env"), "NEXTAUTH_SECRET=0123456789abcdef0123\nDB_USER=app\nDB_MIGRATOR_USER=owner\nDB_MIGRATOR_PASSWORD=old-secret-pass\nDB_PORT=3307\n");
    bash(root, "ensure_env >/dev/null");
    const env = readFileSync(path.join(root, ".env"), "utf8");
    expect(env).toBe("NEXTAUTH_SECRET=0123456789abcdef0123\nDB_USER=app\nDB_PORT=3307\n");
    const migrator = readFileSync(path.join(root, ".env.migrator"), "utf8");
    expect(migrator).toMatch(/^DB_MIGRATOR_USER=owner$/m);
    expect(migrator).toMatch(/^DB_MIGRATOR_PASSWORD=old-secret-pass$/m);
    expect(statSync(path.join(root, ".env.migrator")).mode & 0o777).toBe(0o600);
  });

  it("a process started through WITHOUT_MIGRATOR (app, outbox sender, build) has no DB_MIGRATOR_* in its environment", () => {
    const root = tempApp();
    const out = bash(
      root,
      `export DB_MIGRATOR_USER=owner DB_MIGRATOR_PASSWORD=secret DB_USER=app
       "\${WITHOUT_MIGRATOR[@]}" node -e 'console.log(JSON.stringify(["DB_USER", "DB_MIGRATOR_USER", "DB_MIGRATOR_PASSWORD"].filter(k => k in process.env)))'
       node -e 'console.log(JSON.stringify(["DB_USER", "DB_MIGRATOR_USER", "DB_MIGRATOR_PASSWORD"].filter(k => k in process.env)))'`,
    );
    const [stripped, plain] = out.trim().split("\n").map((l) => JSON.parse(l) as string[]);
    expect(stripped).toEqual(["DB_USER"]);
    expect(plain.sort()).toEqual(["DB_MIGRATOR_PASSWORD", "DB_MIGRATOR_USER", "DB_USER"]);
  });

  it("every long-running process and build step in start.sh is launched through WITHOUT_MIGRATOR; only the migration is not", () => {
    const start = readFileSync(path.join(ROOT, "scripts/start.sh"), "utf8");
    const launches = start.split("\n").filter((l) => /\bnode\b/.test(l) && !/^\s*#/.test(l) && !/node -e/.test(l));
    expect(launches.length).toBeGreaterThanOrEqual(8);
    for (const line of launches) {
      if (line.includes("scripts/migrate.ts")) expect(line).not.toContain("WITHOUT_MIGRATOR");
      else expect(line, line).toContain('"${WITHOUT_MIGRATOR[@]}" node');
    }
  });
});

describe("Next.js's own .env loading (@next/env, what next start and next build use)", () => {
  it("reads .env but never .env.migrator", () => {
    const root = tempApp();
    writeFileSync(path.join(root, ".env"), "SW_T_FROM_DOTENV=app\n");
    writeFileSync(path.join(root, ".env.migrator"), "DB_MIGRATOR_USER=owner-from-file\nDB_MIGRATOR_PASSWORD=secret-from-file\nSW_T_FROM_MIGRATOR=1\n");
    const { combinedEnv, loadedEnvFiles } = nextEnv.loadEnvConfig(root, false, { info: () => {}, error: () => {} }, true);
    expect(combinedEnv.SW_T_FROM_DOTENV).toBe("app");
    expect(loadedEnvFiles.map((f) => f.path)).toEqual([".env"]);
    expect(combinedEnv.SW_T_FROM_MIGRATOR).toBeUndefined();
    expect(combinedEnv.DB_MIGRATOR_USER).not.toBe("owner-from-file");
    expect(combinedEnv.DB_MIGRATOR_PASSWORD).not.toBe("secret-from-file");
    expect(existsSync(path.join(root, ".env.migrator"))).toBe(true);
  });
});

describe("loadMigratorEnv (db:migrate, db:backup, db:restore)", () => {
  it("reads .env and then .env.migrator, never overriding what is set", () => {
    const root = tempApp();
    writeFileSync(path.join(root, ".env"), "SW_T_APP=from-env\n");
    writeFileSync(path.join(root, ".env.migrator"), "SW_T_OWNER=owner\nSW_T_APP=from-migrator\n");
    try {
      loadMigratorEnv(root);
      expect(process.env.SW_T_APP).toBe("from-env");
      expect(process.env.SW_T_OWNER).toBe("owner");
    } finally {
      delete process.env.SW_T_APP;
      delete process.env.SW_T_OWNER;
    }
  });
});

describe("assertNoMigratorCredentials (instrumentation.ts, the outbox sender)", () => {
  it("refuses an app environment holding the migrator's credentials, naming the variables and .env.migrator", () => {
    expect(() => assertNoMigratorCredentials({ DB_USER: "app", DB_MIGRATOR_USER: "owner", DB_MIGRATOR_PASSWORD: "x" })).toThrow(
      /DB_MIGRATOR_USER \/ DB_MIGRATOR_PASSWORD are in the app's environment.*\.env\.migrator/,
    );
    expect(() => assertNoMigratorCredentials({ DB_USER: "app", DB_MIGRATOR_PASSWORD: "x" })).toThrow(/\.env\.migrator/);
  });
  it("accepts an environment without them, and an installation with one account", () => {
    expect(() => assertNoMigratorCredentials({ DB_USER: "app" })).not.toThrow();
    expect(() => assertNoMigratorCredentials({ DB_USER: "app", DB_MIGRATOR_USER: "", DB_MIGRATOR_PASSWORD: "" })).not.toThrow();
    expect(() => assertNoMigratorCredentials({ DB_USER: "app", DB_MIGRATOR_USER: "app", DB_MIGRATOR_PASSWORD: "p" })).not.toThrow();
  });
});
