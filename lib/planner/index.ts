/**
 * Sievewright planner: population spreads, per-point recovery and purity for a sort design, drive voltage and
 * side-effect constraints, ranked operating windows and their sensitivity. Pure library code, SI units.
 */
export { planWindows, PLANNER_VERSION, assumptions, crossoverCurve, type WindowsResult } from "./plan";
export { sensitivity, type SensitivityResult, type SensitivityItem, type WindowRef, type Band } from "./sensitivity";
export { windowsRequestSchema, PLANNER_LIMITS, type WindowsRequest, type PopulationSpec, type PopulationEntry, type SpreadParameter } from "./schema";
export { populationSpecSchema, SHELL_MODELS } from "@/lib/populations/spec";
export { defaultConstraints, defaultSeparation, DEFAULT_TARGET_SPEED, resolveConstraints, resolveSeparation, osmolalityBandFor, OSMOLALITY_BANDS, type Constraints, type SeparationSettings, type OsmolalityBand } from "./constraints";
export { describeDesign, purity, type SortDesign } from "./design";
export { SCORE_WEIGHTS, findRuns, findRegions, type OperatingWindow, type ScorePart, type Run, type Region } from "./windows";
export { crossoverBranches, meanCellGrid, type Branch } from "./branches";
export { diagnose, reasonsAt, BLOCKER_LABELS, type Diagnosis, type BlockerCount, type BlockedPoint, type BlockingReason } from "./diagnosis";
export { MODEL_PREDICTION_WARNING, type PlannerWarning, type WarningSeverity } from "./warnings";
export { evaluateGrid, LIMITED_BY, BLOCKERS, blockersOf, type Blocker, type GridResult, type GridSetup, type HeatingModel, type LimitedBy, type PopulationSample } from "./evaluate";
export { resolveRequest, buildSetup, poiseuilleSpeed, REQUEST_DEFAULTS, DEFAULT_ARRAY_AREA, type ResolvedRequest } from "./prepare";
export { samplePopulation, particleFrom, presentParameters, drawValue, withMean, spreadAt, SPREAD_PARAMETERS, type SpreadPath } from "./populations";
export { mulberry32, fmix32, streamSeed, normalSource } from "./prng";
export { kthSmallest } from "./select";
export { EngineValidationError } from "@/lib/dielectric";
