import { InputError, TooLargeError, type FieldIssue } from "@/lib/errors";
import { formatFileSize } from "@/lib/units/size";

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
      `The file is ${formatFileSize(sizeBytes, { exact: true })}; crossover files are limited to ${formatFileSize(maxBytes, { exact: true })}. ` +
        "A crossover data set is usually a few dozen rows; split or trim the file.",
    );
    this.name = "CsvTooLargeError";
  }
}

