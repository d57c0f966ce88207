/**
 * Benchmarks of the engine and the planner (`npm run bench`). Prints the median wall-clock and CPU time of repeated
 * in-process runs for each target and writes the figures to bench/results.md.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import os from "node:os";
import { performance } from "node:perf_hooks";
import { buildParticle, ENGINE_VERSION, evaluateSpectra, evaluateSweep, PARTICLE_PRESETS } from "../lib/dielectric";
import { planWindows, PLANNER_VERSION, type PopulationSpec, type WindowsRequest } from "../lib/planner";
import { benchCellFits } from "./bench-fits";

interface Row {
  name: string;
  target: number;
  median: number;
  p95: number;
  cpuMedian: number;
  runs: number;
}

function measure(name: string, targetMs: number, fn: () => unknown, runs: number, warmup: number): Row {
  for (let i = 0; i < warmup; i++) fn();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    fn();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  wall.sort((x, y) => x - y);
  cpu.sort((x, y) => x - y);
  const row = { name, target: targetMs, median: wall[Math.floor(runs / 2)], p95: wall[Math.min(runs - 1, Math.floor(runs * 0.95))], cpuMedian: cpu[Math.floor(runs / 2)], runs };
  console.log(`${name}: median ${row.median.toFixed(3)} ms (CPU ${row.cpuMedian.toFixed(3)} ms), p95 ${row.p95.toFixed(3)} ms; target ≤ ${targetMs} ms, ${runs} runs: ${row.median <= targetMs ? "meets target" : "SLOWER THAN TARGET"}`);
  return row;
}

const yeastLive = buildParticle("yeast-viable", PARTICLE_PRESETS.yeastViable.model);
const yeastDead = buildParticle("yeast-heat-killed", PARTICLE_PRESETS.yeastHeatKilled.model);

const sp = (mean: number, cv = 0.1) => ({ mean, cv, distribution: "normal" as const });
const live: PopulationSpec = { model: "single-shell", radius: sp(3.5e-6), interior: { permittivity: sp(60), conductivity: sp(0.5) }, membrane: { thickness: 7e-9, capacitance: sp(0.01), conductance: { mean: 1, cv: 0.5, distribution: "lognormal" } } };
const dead: PopulationSpec = { model: "single-shell", radius: sp(3.3e-6), interior: { permittivity: sp(60), conductivity: sp(0.05, 0.3) }, membrane: { thickness: 7e-9, capacitance: sp(0.01), conductance: { mean: 1e4, cv: 0.5, distribution: "lognormal" } } };
const windowsRequest: WindowsRequest = {
  populations: [{ id: "live", spec: live }, { id: "dead", spec: dead }],
  medium: { conductivityRange: { start: 1e-3, stop: 1, points: 61 } },
  frequencies: { start: 1e3, stop: 1e9, points: 121 },
  device: { geometry: { kind: "interdigitated", electrodeWidth: 20e-6, electrodeGap: 20e-6 }, maxVoltageVpp: 20, channelHeight: 50e-6 },
  samplesPerPopulation: 500,
  seed: 7,
};

const load = os.loadavg()[0];
const rows: Row[] = [
  measure(
    "evaluateSweep: 241 frequencies × 121 conductivities × 2 double-shell particles",
    1,
    () => evaluateSweep({ mediumPermittivity: 78.3, frequencies: { start: 1e3, stop: 1e9, points: 241 }, conductivities: { start: 1e-4, stop: 1, points: 121 }, particles: [yeastLive, yeastDead] }),
    400,
    40,
  ),
  measure(
    "evaluateSpectra: 2 double-shell particles × 2001 frequencies, with crossovers",
    5,
    () => evaluateSpectra({ medium: { conductivity: 0.01, permittivity: 78.3 }, frequencies: { start: 1e3, stop: 1e9, points: 2001 }, particles: [yeastLive, yeastDead] }),
    200,
    20,
  ),
  measure("planWindows: 2 single-shell populations × 500 cells, 121 frequencies × 61 conductivities", 300, () => planWindows(windowsRequest), 15, 3),
];
const fits = await benchCellFits();
const warm = fits.wall.slice(1).sort((a, b) => a - b);
rows.push({ name: `fitCellsInPool: 500 cells × 20 frequencies, 3 parameters each, in worker threads (first run, starting the threads: ${fits.wall[0].toFixed(0)} ms; longest event-loop delay meanwhile ${fits.maxLoopDelayMs.toFixed(0)} ms)`, target: 10_000, median: warm[Math.floor(warm.length / 2)], p95: warm[warm.length - 1], cpuMedian: Number.NaN, runs: warm.length });
console.log(`fitCellsInPool: runs ${fits.wall.map((w) => w.toFixed(0)).join(", ")} ms; ${fits.included} cells included; max event-loop delay ${fits.maxLoopDelayMs.toFixed(0)} ms`);
const loadAfter = os.loadavg()[0];

const lines = [
  "# Benchmark results",
  "",
  `Written by \`npm run bench\` (scripts/bench.ts). Engine ${ENGINE_VERSION}, planner ${PLANNER_VERSION}; Node ${process.version}; ${os.cpus().length} × ${os.cpus()[0]?.model ?? "CPU"}; ${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC.`,
  `1-minute load average ${load.toFixed(1)} before and ${loadAfter.toFixed(1)} after the run (on ${os.cpus().length} cores: above ${os.cpus().length} means other work shared the CPU and wall-clock times are inflated; CPU time is less affected).`,
  "Each figure is the median of repeated in-process runs after a warm-up, including request validation. CPU = user + system time of this process.",
  "",
  "| benchmark | median wall (ms) | median CPU (ms) | p95 wall (ms) | target (ms) | runs | median meets target |",
  "|---|---:|---:|---:|---:|---:|---|",
  ...rows.map((r) => `| ${r.name} | ${r.median.toFixed(3)} | ${Number.isNaN(r.cpuMedian) ? "(in workers)" : r.cpuMedian.toFixed(3)} | ${r.p95.toFixed(3)} | ≤ ${r.target} | ${r.runs} | ${r.median <= r.target ? "yes" : "no"} |`),
  "",
];
mkdirSync("bench", { recursive: true });
writeFileSync("bench/results.md", lines.join("\n"));
console.log("wrote bench/results.md");
