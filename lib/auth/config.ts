import { z } from "zod";

/**
 * Sign-in, attempt-limit, session and password-link settings, read from the environment and checked with zod.
 * Every variable is optional; README ("Security") lists them with their defaults.
 */
const count = (fallback: number, max: number) => z.coerce.number().int().min(0).max(max).default(fallback);
const atLeastOne = (fallback: number, max: number) => z.coerce.number().int().min(1).max(max).default(fallback);

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

/** The checked settings. */
export type AuthConfig = z.output<typeof AUTH_SETTINGS>;

const NAMES = Object.keys(AUTH_SETTINGS.shape) as (keyof AuthConfig)[];
let cache: { key: string; config: AuthConfig } | null = null;

/**
 * The settings, parsed again only when one of the variables changed; a bad value throws naming the variable and rule.
 * @example authConfig().AUTH_LOCK_MINUTES // 15 unless set
 */
export function authConfig(source: Record<string, string | undefined> = process.env): AuthConfig {
  const key = NAMES.map((n) => source[n] ?? "").join("\u0000");
  if (cache?.key === key) return cache.config;
  const raw = Object.fromEntries(NAMES.map((n) => [n, source[n] === "" ? undefined : source[n]]));
  const parsed = AUTH_SETTINGS.safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${String(i.path[0])}: ${i.message} (value ${JSON.stringify(raw[String(i.path[0])])})`);
    throw new Error(`Configuration error: ${problems.join("; ")}`);
  }
  cache = { key, config: parsed.data };
  return parsed.data;
}
