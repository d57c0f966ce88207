import { InputError, TooLargeError, type FieldIssue } from "@/lib/errors";

/**
 * Points or options handed to `fitMembrane` that cannot be fitted (non-finite or non-positive
 * values, no radius, fewer points than parameters). One issue per field, e.g.
 * `{ path: "points[2].conductivity", message: "must be a positive number in S/m; got -0.01" }`.
 */
export class FittingInputError extends InputError {
  constructor(issues: FieldIssue[]) {
    super(issues);
    this.name = "FittingInputError";
  }
}

/**
 * A crossover CSV whose header cannot be read (missing column, unknown unit, duplicate column)
 * or which has no header at all. Each issue's path is "header" or "header.<column>".
 */
export class CsvHeaderError extends InputError {
  constructor(issues: FieldIssue[]) {
    super(issues);
    this.name = "CsvHeaderError";
  }
}

/** A crossover CSV larger than the cap; refused before parsing. Maps to HTTP 413. */
export class CsvTooLargeError extends TooLargeError {
  constructor(
    readonly sizeBytes: number,
    readonly maxBytes: number,
  ) {
    super(
      `The file is ${formatBytes(sizeBytes)}; crossover files are limited to ${formatBytes(maxBytes)}. ` +
        "A crossover data set is usually a few dozen rows; split or trim the file.",
    );
    this.name = "CsvTooLargeError";
  }
}

function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(2)} MiB (${n} bytes)`;
  if (n >= 1024) return `${(n / 1024).toFixed(1)} KiB (${n} bytes)`;
  return `${n} bytes`;
}
