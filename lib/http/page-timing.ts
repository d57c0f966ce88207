import { after } from "next/server";
import { cache } from "react";
import { readEnv } from "@/lib/env";
import { ServerTiming } from "./timing";

/**
 * Server-Timing for pages. A page's headers are sent before its server components finish, so pages cannot send a
 * `server-timing` header; instead their data-loading steps are timed per request (React's request cache gives every
 * server component of one render the same ServerTiming) and, with SERVER_TIMING_LOG=1, logged once the response has
 * been sent: `[server-timing] /protocols/[id]/versions/[n] session;dur=2.0, view;dur=9.1, …, app;dur=41.3` (ms; `app`
 * runs from the first timed step to the end of the response). The proxy sends its own share as `server-timing: proxy`.
 */
const requestTiming = cache(() => new ServerTiming());

/**
 * Times one asynchronous data-loading step of the page being rendered.
 * @example const view = await timed("view", () => getVersionView(user, 1, 1));
 */
export function timed<T>(name: string, fn: () => Promise<T>): Promise<T> {
  return requestTiming().step(name, fn);
}

/**
 * Times one synchronous step (a computation) of the page being rendered.
 * @example const spectra = timedSync("spectra", () => versionSpectra(content, hash));
 */
export function timedSync<T>(name: string, fn: () => T): T {
  return requestTiming().measure(name, fn);
}

/**
 * Logs the page's steps after its response is sent, when SERVER_TIMING_LOG=1 (call once, from the page).
 * @example logPageTiming("/protocols/[id]/versions/[n]");
 */
export function logPageTiming(route: string): void {
  if (!readEnv().SERVER_TIMING_LOG) return;
  const timing = requestTiming();
  after(() => console.log(`[server-timing] ${route} ${timing.header()}`));
}
