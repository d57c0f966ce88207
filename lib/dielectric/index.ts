/**
 * Sievewright dielectric engine: Clausius–Mossotti spectra and sweeps of shelled particles, crossover frequencies,
 * medium and buffer properties, DEP motion and side-effect estimates. Pure TypeScript, SI units throughout.
 */
export { ENGINE_VERSION } from "./version";
export * from "./units";
export { EngineValidationError, EngineComputationError, type ValidationIssue } from "./errors";
export * from "./types";
export { LIMITS } from "./limits";
export {
  spectraRequestSchema,
  sweepRequestSchema,
  particleSchema,
  shellSchema,
  mediumConductivitySchema,
  mediumPermittivitySchema,
  validateSpectraRequest,
  validateSweepRequest,
  parseOrThrow,
  formatPath,
  describeValue,
  quantity,
} from "./validation";
export { complexPermittivity, relativeLossPart, divideInto, type ComplexPair } from "./complex";
export { realCM, imagCM, lowFrequencyLimit, highFrequencyLimit, maxwellWagnerFrequency, homogeneousCrossover, type HomogeneousPair } from "./cm";
export { shellMaterial, compileParticle, effectivePermittivityInto, effectivePermittivity, type CompiledParticle } from "./shells";
export { logSpace } from "./grid";
export { brentRoot, goldenMin } from "./roots";
export { crossoverFrequencies, signChanges, DEFAULT_CROSSOVER_RANGE, CROSSOVER_POINTS_PER_DECADE } from "./crossovers";
export { evaluateSpectra } from "./spectra";
export { evaluateSweep, fillRealCMGrid } from "./sweep";
export * from "./medium";
export * from "./buffer";
export * from "./motion";
export * from "./electrodes";
export * from "./sideEffects";
export * from "./arrayHeating";
export * from "./presets";
