import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { ENV_SCHEMA, readEnv } from "@/lib/env";

describe("readEnv — every variable parsed once with its rule", () => {
  it("gives the documented defaults when nothing is set", () => {
    const env = readEnv({});
    expect(env).toMatchObject({
      APP_BASE_URL: "http://127.0.0.1:3000",
      SMTP_PORT: 2525,
      SMTP_SECURE: false,
      PDF_WORKERS: 1,
      UPLOAD_MAX_MB: 10,
      RATE_LIMIT_PER_MINUTE: 120,
      OUTBOX_MAX_ATTEMPTS: 12,
      S3_FORCE_PATH_STYLE: true,
      SESSION_IDLE_MINUTES: 30,
    });
    expect(env.RATE_LIMIT_SESSION_PER_MINUTE).toBeUndefined();
  });

  it("converts and trims values; an empty value counts as unset; a trailing slash leaves the base URL", () => {
    const env = readEnv({ SMTP_PORT: " 2626 ", SMTP_SECURE: "yes", APP_BASE_URL: "https://sort.lab.example/", PDF_WORKERS: "" });
    expect(env.SMTP_PORT).toBe(2626);
    expect(env.SMTP_SECURE).toBe(true);
    expect(env.APP_BASE_URL).toBe("https://sort.lab.example");
    expect(env.PDF_WORKERS).toBe(1);
  });

  it.each([
    ["SMTP_PORT", "70000"],
    ["PDF_WORKERS", "0"],
    ["UPLOAD_MAX_MB", "-1"],
    ["UPLOAD_MAX_MB", "20"],
    ["APP_BASE_URL", "ftp://files.example"],
    ["APP_WORKERS", "many"],
    ["SMTP_SECURE", "perhaps"],
    ["RATE_LIMIT_SESSION_PER_MINUTE", "2.5"],
    ["S3_BUCKET", "Bad_Bucket"],
    ["SESSION_IDLE_MINUTES", "0"],
    ["DB_NAME", "drop table;"],
  ])("refuses %s=%s with a message naming the variable and the value", (name, value) => {
    expect(() => readEnv({ [name]: value })).toThrow(new RegExp(`^Configuration error: .*${name}: .*\\(value ${JSON.stringify(value).replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}\\)`));
  });

  it("names every bad variable at once", () => {
    expect(() => readEnv({ SMTP_PORT: "x", OUTBOX_MAX_ATTEMPTS: "0" })).toThrow(/SMTP_PORT: .*; OUTBOX_MAX_ATTEMPTS: /);
  });
});

describe("modules that read their settings through lib/env.ts", () => {
  it("object store: unset S3_ENDPOINT is the local fake, an empty one the provider's default; keys keep an empty value", async () => {
    const { storageConfig } = await import("@/lib/storage/config");
    expect(storageConfig({})).toMatchObject({ endpoint: "http://127.0.0.1:4500", region: "us-east-1", bucket: "sievewright", accessKeyId: "S3RVER", forcePathStyle: true });
    expect(storageConfig({ S3_ENDPOINT: "", S3_SECRET_ACCESS_KEY: "" })).toMatchObject({ endpoint: undefined, secretAccessKey: "" });
    expect(storageConfig({ S3_ENDPOINT: " https://s3.example ", S3_FORCE_PATH_STYLE: "no" })).toMatchObject({ endpoint: "https://s3.example", forcePathStyle: false });
    expect(() => storageConfig({ S3_BUCKET: "Bad_Bucket" })).toThrow(/S3_BUCKET/);
  });

  it("database: the migrator account falls back to the app account; an empty password stays empty; a bad port is named", async () => {
    const { dbConfig, dbCredentials } = await import("@/db/config");
    expect(dbCredentials("migrator", { DB_USER: "app", DB_PASSWORD: "" })).toEqual({ user: "app", password: "" });
    expect(dbCredentials("migrator", { DB_MIGRATOR_USER: "owner", DB_MIGRATOR_PASSWORD: "pw" })).toEqual({ user: "owner", password: "pw" });
    expect(dbCredentials("app", {})).toEqual({ user: "sievewright", password: "sievewright-local" });
    expect(() => dbCredentials("app", { DB_PORT: "99999" })).toThrow(/DB_PORT/);
    expect(dbConfig().connection).toMatchObject({ host: readEnv().DB_HOST, port: readEnv().DB_PORT, database: readEnv().DB_NAME });
  });

  it("auth settings come from the same table", async () => {
    const { authConfig } = await import("@/lib/auth/config");
    expect(authConfig({}).AUTH_LOCK_MINUTES).toBe(15);
    expect(authConfig({ AUTH_LOCK_MINUTES: "20" }).AUTH_LOCK_MINUTES).toBe(20);
    expect(() => authConfig({ AUTH_LOCK_MINUTES: "0" })).toThrow(/AUTH_LOCK_MINUTES/);
  });
});

describe("the README documents every variable lib/env.ts reads", () => {
  it("names each ENV_SCHEMA variable in back-quotes", () => {
    const readme = readFileSync("README.md", "utf8");
    const missing = Object.keys(ENV_SCHEMA.shape).filter((name) => !readme.includes(`\`${name}\``));
    expect(missing).toEqual([]);
  });
});
