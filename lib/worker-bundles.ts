import { existsSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";

/**
 * The worker-thread entries that scripts/build-workers.mjs bundles into build/workers/<name>.mjs (plain ES modules,
 * packages external), so a Piscina pool loads the same file under `next start`, `next dev`, vitest and tsx.
 */
export type WorkerBundle = "bench-sheet" | "cell-fit";

/**
 * Where a bundled worker entry lives.
 * @example workerBundlePath("cell-fit") // "/srv/sievewright/build/workers/cell-fit.mjs"
 */
export function workerBundlePath(name: WorkerBundle, root = process.cwd()): string {
  return path.join(root, "build", "workers", `${name}.mjs`);
}

/**
 * The file URL a Piscina pool takes for a bundled worker entry; throws a plain instruction when it was not built.
 * @example new Piscina({ filename: workerBundleUrl("bench-sheet") })
 */
export function workerBundleUrl(name: WorkerBundle, root = process.cwd()): string {
  const file = workerBundlePath(name, root);
  if (!existsSync(file)) throw new Error(`The ${name} worker is not built (${file} is missing): run \`node scripts/build-workers.mjs\` (part of npm run build).`);
  return pathToFileURL(file).href;
}
