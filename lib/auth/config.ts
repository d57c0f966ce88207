import { readEnv, type AUTH_SETTINGS } from "@/lib/env";
import type { z } from "zod";

/**
 * Sign-in, attempt-limit, session and password-link settings. Their rules and defaults sit in lib/env.ts
 * (AUTH_SETTINGS) with every other variable; README ("Security") lists them.
 */

/** The checked settings. */
export type AuthConfig = z.output<typeof AUTH_SETTINGS>;

/**
 * The settings from lib/env.ts (`source` lets a test inject its own variables); a bad value throws naming the
 * variable and rule.
 * @example authConfig().AUTH_LOCK_MINUTES // 15 unless set
 */
export function authConfig(source?: Record<string, string | undefined>): AuthConfig {
  return readEnv(source);
}
