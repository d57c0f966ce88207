import { z } from "zod";
import { AUTH_SETTINGS } from "@/lib/auth/config";

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
    .refine((v) => /^https?:\/\//.test(v), "must start with http:// or https://")
    .default(fallback)
    .transform((v) => v.replace(/\/+$/, ""));

export const ENV_SCHEMA = z.object({
  APP_BASE_URL: httpUrl("http://127.0.0.1:3000"),
  NEXTAUTH_URL: httpUrl("http://127.0.0.1:3000"),
  NEXTAUTH_SECRET: z.string().min(16, "must be at least 16 characters (npm start writes a random one into .env)").optional(),
  APP_WORKERS: z.string().regex(/^(auto|[1-9]\d?)$/, 'must be "auto" or a whole number from 1 to 99').optional(),
  DB_HOST: z.string().min(1).default("127.0.0.1"),
  DB_PORT: whole(3307, 1, 65535),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]{1,64}$/, "must be 1–64 letters, digits or underscores").default("sievewright"),
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
  S3_ENDPOINT: z.string().url().optional(),
  S3_REGION: z.string().regex(/^[a-z0-9-]{2,32}$/, "must be a region name such as us-east-1").optional(),
  S3_BUCKET: z.string().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, "must be a bucket name: 3–63 lower-case letters, digits, dots or hyphens").optional(),
  S3_FORCE_PATH_STYLE: flag(true),
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
  const raw = Object.fromEntries(NAMES.map((n) => [n, source[n] === "" ? undefined : source[n]?.trim()]));
  const parsed = ENV_SCHEMA.safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${String(i.path[0])}: ${i.message} (value ${JSON.stringify(raw[String(i.path[0])])})`);
    throw new Error(`Configuration error: ${problems.join("; ")}`);
  }
  if (source === process.env) cache = { key, env: parsed.data };
  return parsed.data;
}

/**
 * Parses the environment once at start and throws, naming each bad variable, before the server takes a request.
 * @example checkEnv(); // in instrumentation.ts register()
 */
export function checkEnv(source: Record<string, string | undefined> = process.env): void {
  readEnv(source);
}
