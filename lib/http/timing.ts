import { serverTimingDuration } from "@/lib/units/duration";

/**
 * Server-Timing: time named steps of one request. Route handlers send them as the `server-timing` header (browsers'
 * developer tools and `npm run load` read it); pages log them (lib/http/page-timing.ts). Durations in milliseconds.
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
   * Runs one synchronous step and records how long it took.
   * @example const lines = timing.measure("spectra", () => versionSpectra(content, hash));
   */
  measure<T>(name: string, fn: () => T): T {
    const t0 = performance.now();
    try {
      return fn();
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
