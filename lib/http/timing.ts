import { serverTimingDuration } from "@/lib/units/duration";

/**
 * Server-Timing for route handlers: time named steps of one request and send them as the `server-timing` header
 * (browsers' developer tools and `npm run load` read it). Durations in milliseconds.
 */
export class ServerTiming {
  private readonly start = performance.now();
  private readonly steps: [string, number][] = [];

  /**
   * Runs one step and records how long it took.
   * @example const source = await timing.step("db", () => loadSheetSourceByNumber(user, 1, 1));
   */
  async step<T>(name: string, fn: () => Promise<T>): Promise<T> {
    const t0 = performance.now();
    try {
      return await fn();
    } finally {
      this.steps.push([name, performance.now() - t0]);
    }
  }

  /**
   * The header value: every step, then `app` for the whole request so far.
   * @example timing.header() // "db;dur=4.1, sheet;dur=2.9, app;dur=7.6"
   */
  header(): string {
    return [...this.steps, ["app", performance.now() - this.start] as [string, number]].map(([n, d]) => `${n};dur=${serverTimingDuration(d, 1)}`).join(", ");
  }
}
