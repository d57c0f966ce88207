/**
 * Benchmarks of the engine and the planner (`npm run bench`). Prints the median of repeated runs for each target
 * and writes the figures to bench/results.md.
 */
import { writeFileSync, mkdirSync } from "node:fs";
import os from "node:os";
import { performance } from "node:perf_hooks";
import { buildParticle, evaluateSpectra, evaluateSweep, PARTICLE_PRESETS, ENGINE_VERSION } from "../lib/dielectric";

interface Row {
  name: string;
  target: number;
  median: number;
  p95: number;
  runs: number;
}

function measure(name: string, targetMs: number, fn: () => unknown, runs: number, warmup = 20): Row {
  for (let i = 0; i < warmup; i++) fn();
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const a = performance.now();
    fn();
    t.push(performance.now() - a);
  }
  t.sort((x, y) => x - y);
  const row = { name, target: targetMs, median: t[Math.floor(runs / 2)], p95: t[Math.min(runs - 1, Math.floor(runs * 0.95))], runs };
  console.log(`${name}: median ${row.median.toFixed(3)} ms, p95 ${row.p95.toFixed(3)} ms (target ≤ ${targetMs} ms, ${runs} runs) ${row.median <= targetMs ? "OK" : "SLOWER THAN TARGET"}`);
  return row;
}

const yeastLive = buildParticle("yeast-viable", PARTICLE_PRESETS.yeastViable.model);
const yeastDead = buildParticle("yeast-heat-killed", PARTICLE_PRESETS.yeastHeatKilled.model);

const rows: Row[] = [];
rows.push(
  measure(
    "evaluateSweep: 241 frequencies × 121 conductivities × 2 double-shell particles",
    1,
    () => evaluateSweep({ mediumPermittivity: 78.3, frequencies: { start: 1e3, stop: 1e9, points: 241 }, conductivities: { start: 1e-4, stop: 1, points: 121 }, particles: [yeastLive, yeastDead] }),
    400,
  ),
);
rows.push(
  measure(
    "evaluateSpectra: 2 double-shell particles × 2001 frequencies, with crossovers",
    5,
    () => evaluateSpectra({ medium: { conductivity: 0.01, permittivity: 78.3 }, frequencies: { start: 1e3, stop: 1e9, points: 2001 }, particles: [yeastLive, yeastDead] }),
    200,
  ),
);

const lines = [
  "# Benchmark results",
  "",
  `Written by \`npm run bench\` (scripts/bench.ts). Engine ${ENGINE_VERSION}; Node ${process.version}; ${os.cpus().length} × ${os.cpus()[0]?.model ?? "CPU"}; ${new Date().toISOString().slice(0, 10)}.`,
  "Each figure is the median (and 95th percentile) of repeated in-process runs after a warm-up, including request validation.",
  "",
  "| benchmark | median (ms) | p95 (ms) | target (ms) | runs | meets target |",
  "|---|---:|---:|---:|---:|---|",
  ...rows.map((r) => `| ${r.name} | ${r.median.toFixed(3)} | ${r.p95.toFixed(3)} | ≤ ${r.target} | ${r.runs} | ${r.median <= r.target ? "yes" : "no"} |`),
  "",
];
mkdirSync("bench", { recursive: true });
writeFileSync("bench/results.md", lines.join("\n"));
console.log("wrote bench/results.md");
