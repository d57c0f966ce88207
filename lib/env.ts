import { z } from "zod";

/**
 * Every environment variable the app reads, in one zod table: name, rule and default. `readEnv()` parses it (again
 * only when a value changed, so tests may set variables in-process) and `checkEnv()` runs once at start
 * (instrumentation.ts, the outbox sender) so a bad value stops the server with a message naming the variable.
 * .env.example and the README's configuration table document the same names.
 */
const whole = (fallback: number, min: number, max: number) => z.coerce.number().int().min(min).max(max).default(fallback);
const flag = (fallback: boolean) =>
  z
    .enum(["true", "false", "1", "0", "yes", "no", "on", "off"])
    .default(fallback ? "true" : "false")
    .transform((v) => ["true", "1", "yes", "on"].includes(v));
const httpUrl = (fallback: string) =>
  z
    .string()
    .url()
    .refine((v) => /^https?:\/\//i.test(v), "must start with http:// or https://")
    .default(fallback)
    .transform((v) => v.replace(/\/+$/, ""));

const count = (fallback: number, max: number) => z.coerce.number().int().min(0).max(max).default(fallback);
const atLeastOne = (fallback: number, max: number) => z.coerce.number().int().min(1).max(max).default(fallback);

/** Sign-in, attempt-limit, session and password-link settings (README, "Security"); lib/auth/config.ts reads them. */
export const AUTH_SETTINGS = z.object({
  AUTH_ACCOUNT_DELAY_AFTER: atLeastOne(5, 1000),
  AUTH_ACCOUNT_LOCK_AFTER: atLeastOne(10, 1000),
  AUTH_ADDRESS_DELAY_AFTER: atLeastOne(20, 100_000),
  AUTH_ADDRESS_LOCK_AFTER: atLeastOne(100, 100_000),
  AUTH_LOCK_MINUTES: atLeastOne(15, 24 * 60),
  AUTH_FAILURE_MEMORY_MINUTES: atLeastOne(60, 7 * 24 * 60),
  AUTH_TRUSTED_PROXY_HOPS: count(0, 10),
  SESSION_IDLE_MINUTES: atLeastOne(30, 24 * 60),
  SESSION_MAX_HOURS: atLeastOne(12, 30 * 24),
  PASSWORD_SETUP_LINK_HOURS: atLeastOne(72, 30 * 24),
  PASSWORD_RESET_LINK_MINUTES: atLeastOne(60, 24 * 60),
});

/**
 * Variables whose empty value means something of its own, so it is kept rather than read as unset: an empty
 * password (an account without one), an empty S3_ENDPOINT (the provider's default endpoint for the region).
 */
const EMPTY_KEPT = new Set(["DB_PASSWORD", "DB_MIGRATOR_PASSWORD", "DB_BACKUP_PASSWORD", "S3_ENDPOINT", "S3_ACCESS_KEY_ID", "S3_SECRET_ACCESS_KEY"]);

export const ENV_SCHEMA = z.object({
  APP_BASE_URL: httpUrl("http://127.0.0.1:3000"),
  NEXTAUTH_URL: httpUrl("http://127.0.0.1:3000"),
  NEXTAUTH_SECRET: z.string().min(16, "must be at least 16 characters (npm start writes a random one into .env)").optional(),
  APP_WORKERS: z.string().regex(/^(auto|[1-9]\d?)$/, 'must be "auto" or a whole number from 1 to 99').optional(),
  DB_HOST: z.string().min(1).default("127.0.0.1"),
  DB_PORT: whole(3307, 1, 65535),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]{1,64}$/, "must be 1–64 letters, digits or underscores").default("sievewright"),
  DB_USER: z.string().min(1).default("sievewright"),
  DB_PASSWORD: z.string().default("sievewright-local"),
  DB_MIGRATOR_USER: z.string().optional(),
  DB_MIGRATOR_PASSWORD: z.string().optional(),
  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: whole(2525, 1, 65535),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  SMTP_SECURE: flag(false),
  SMTP_FROM: z.string().min(3).default("Sievewright <no-reply@sievewright.test>"),
  SMTP_CONNECT_TIMEOUT_MS: whole(5_000, 100, 600_000),
  SMTP_GREETING_TIMEOUT_MS: whole(5_000, 100, 600_000),
  SMTP_SOCKET_TIMEOUT_MS: whole(10_000, 100, 600_000),
  MAIL_SINK_DIR: z.string().optional(),
  OUTBOX_POLL_MS: whole(2_000, 50, 600_000),
  OUTBOX_LEASE_MS: whole(120_000, 1_000, 86_400_000),
  OUTBOX_SEND_DEADLINE_MS: whole(60_000, 500, 86_400_000),
  OUTBOX_MAX_ATTEMPTS: whole(12, 1, 1_000),
  OUTBOX_BACKOFF_BASE_MS: whole(5_000, 1, 3_600_000),
  PDF_WORKERS: whole(1, 1, 16),
  UPLOAD_MAX_MB: z.coerce.number().gt(0).max(12, "must be at most 12: five attachments plus the form must fit the 64 MiB proxy body limit (next.config.mjs)").default(10),
  RATE_LIMIT_PER_MINUTE: whole(120, 1, 10_000_000),
  RATE_LIMIT_SESSION_PER_MINUTE: z.coerce.number().int().min(1).max(10_000_000).optional(),
  /** Unset: the local fake `npm start` runs; empty: the provider's default endpoint for the region. */
  S3_ENDPOINT: z.union([z.literal(""), z.string().url()]).optional(),
  S3_REGION: z.string().regex(/^[a-z0-9-]{2,32}$/, "must be a region name such as us-east-1").optional(),
  S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, "must be a bucket name: 3–63 lower-case letters, digits, dots or hyphens").optional(),
  S3_FORCE_PATH_STYLE: flag(true),
  S3_ACCESS_KEY_ID: z.string().default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().default("S3RVER"),
  /** Backups: an account of their own (read triggers, recreate tables); unset → the migrator account. */
  DB_BACKUP_USER: z.string().optional(),
  DB_BACKUP_PASSWORD: z.string().optional(),
  /** "1" logs each page's step timings after its response (lib/http/page-timing.ts). */
  SERVER_TIMING_LOG: flag(false),
  ...AUTH_SETTINGS.shape,
});

/** The checked settings. */
export type Env = z.output<typeof ENV_SCHEMA>;

const NAMES = Object.keys(ENV_SCHEMA.shape) as (keyof Env)[];
let cache: { key: string; env: Env } | null = null;

/**
 * The settings from `source` (default process.env); an empty value counts as unset. A bad value throws
 * "Configuration error: NAME: rule (value "x")" for every bad variable at once.
 * @example readEnv().SMTP_PORT // 2525 unless set
 */
export function readEnv(source: Record<string, string | undefined> = process.env): Env {
  const key = NAMES.map((n) => source[n] ?? "").join("\u0000");
  if (source === process.env && cache?.key === key) return cache.env;
  const raw = Object.fromEntries(NAMES.map((n) => [n, source[n] === "" && !EMPTY_KEPT.has(n) ? undefined : source[n]?.trim()]));
  const parsed = ENV_SCHEMA.safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${String(i.path[0])}: ${i.message} (value ${JSON.stringify(raw[String(i.path[0])])})`);
    throw new Error(`Configuration error: ${problems.join("; ")}`);
  }
  if (source === process.env) cache = { key, env: parsed.data };
  return parsed.data;
}

/**
 * The app's own URLs as configured (APP_BASE_URL, NEXTAUTH_URL), checked like every variable but without the
 * defaults: only those actually set, so a caller can tell "not configured" from "the default".
 * @example configuredUrls({ NEXTAUTH_URL: "https://sw.lab.example/" }) // { NEXTAUTH_URL: "https://sw.lab.example" }
 */
export function configuredUrls(source: Record<string, string | undefined> = process.env): { APP_BASE_URL?: string; NEXTAUTH_URL?: string } {
  const env = readEnv(source);
  const given = (n: "APP_BASE_URL" | "NEXTAUTH_URL") => (source[n] !== undefined && source[n]?.trim() !== "" ? { [n]: env[n] } : {});
  return { ...given("APP_BASE_URL"), ...given("NEXTAUTH_URL") };
}

/**
 * Parses the environment once at start and throws, naming each bad variable, before the server takes a request.
 * @example checkEnv(); // in instrumentation.ts register()
 */
export function checkEnv(source: Record<string, string | undefined> = process.env): void {
  readEnv(source);
}
