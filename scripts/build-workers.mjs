// Bundles the worker-thread entries (TypeScript under lib/) into plain ES modules under build/workers/, so the worker
// pool loads the same file under `next start`, `next dev`, vitest and tsx. Packages stay external (node_modules).
// Run by `npm run build`, npm start and npm test before anything that renders or fits; takes well under a second.
import { build } from "esbuild";
import path from "node:path";
import { fileURLToPath } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const entries = { "bench-sheet": "lib/bench-sheet/render-worker.ts", "cell-fit": "lib/characterisation/fit-worker.ts" };

await build({
  absWorkingDir: root,
  entryPoints: Object.fromEntries(Object.entries(entries).map(([name, file]) => [name, path.join(root, file)])),
  outdir: path.join(root, "build/workers"),
  outExtension: { ".js": ".mjs" },
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  packages: "external",
  tsconfig: path.join(root, "tsconfig.json"),
  logLevel: "warning",
});
console.log(`[build-workers] ${Object.keys(entries).map((n) => `build/workers/${n}.mjs`).join(", ")}`);
