/**
 * Engine version (semantic versioning). Saved with every protocol version so a result can be
 * traced to the model that produced it. Bump the minor number when a model gains an option,
 * the major number when a number the engine returns for the same input changes.
 */
export const ENGINE_VERSION = "1.0.0";
