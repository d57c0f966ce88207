// Prints "<passed> <failed>" from a vitest or Playwright JSON report (argv[2]).
import { readFileSync } from "node:fs";

const report = JSON.parse(readFileSync(process.argv[2], "utf8"));
let passed = 0;
let failed = 0;
if (typeof report.numPassedTests === "number") {
  passed = report.numPassedTests;
  failed = report.numFailedTests + (report.success === false && report.numFailedTests === 0 ? 1 : 0);
} else if (report.stats) {
  passed = report.stats.expected + (report.stats.flaky ?? 0);
  failed = report.stats.unexpected + (report.errors?.length ? 1 : 0);
}
console.log(`${passed} ${failed}`);
