import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { BUFFER_FIELDS } from "@/lib/buffers/fields";
import { DEVICE_FIELDS } from "@/lib/devices/fields";
import { POPULATION_FIELDS } from "@/lib/populations/fields";
import { fromSI, type UnitId } from "@/lib/units/lab";
import { tidy } from "@/lib/units/number";

/**
 * "Each population, buffer and device range lives in exactly one file": the field tables. This test reads the three
 * tables and looks through lib/, components/ and app/ for a range written out again — the pair of bounds of a field,
 * in SI or in its lab unit, as `min: a, max: b`, `.min(a).max(b)`, `min(a) … max(b)` or "between a and b" — so a
 * second copy cannot creep back in unnoticed. Comments are not code and are skipped. Ranges made only of 0, 1, 2,
 * 10, 100 and 1000 are too common to tell apart (shares, percentages, lengths of text) and are not looked for.
 */

const ROOT = process.cwd();
const TABLES = ["lib/populations/fields.ts", "lib/buffers/fields.ts", "lib/devices/fields.ts"];

/** Places where the same two numbers bound another quantity, each with the reason. */
const ALLOWED: { file: string; range: [number, number]; why: string }[] = [
  { file: "lib/planner/schema.ts", range: [1, 200], why: "the medium's relative permittivity, not a population's" },
  { file: "lib/fitting/spectrum-schema.ts", range: [1, 200], why: "the medium's relative permittivity of a measured spectrum" },
  { file: "lib/fitting/fit-input.ts", range: [1, 200], why: "the medium's relative permittivity of a crossover fit" },
  { file: "lib/fitting/spectrum-schema.ts", range: [1e-6, 20], why: "the medium's conductivity of a measured spectrum, not a population's" },
  { file: "lib/dielectric/medium.ts", range: [0, 60], why: "the water property fits' range: the buffer and device temperature rows take it from here" },
  { file: "lib/bench-sheet/recipe.ts", range: [1, 5000], why: "the bench sheet's batch volume in mL, not a channel height in µm" },
];

interface Range { field: string; lo: number; hi: number }

const fields: { name: string; unit: UnitId; min: number; max: number }[] = [
  ...POPULATION_FIELDS.map((f) => ({ name: `population ${f.path}`, unit: f.unit, min: f.min, max: f.max })),
  ...Object.entries(BUFFER_FIELDS).map(([k, f]) => ({ name: `buffer ${k}`, unit: f.unit, min: f.min, max: f.max })),
  ...Object.entries(DEVICE_FIELDS).map(([k, f]) => ({ name: `device ${k}`, unit: f.unit, min: f.min, max: f.max })),
];
const COMMON = new Set([0, 1, 2, 10, 100, 1000]);
const ranges: Range[] = fields.flatMap((f) =>
  [
    { field: `${f.name} (SI)`, lo: f.min, hi: f.max },
    { field: `${f.name} (${f.unit})`, lo: tidy(fromSI(f.unit, f.min), 9), hi: tidy(fromSI(f.unit, f.max), 9) },
  ].filter((r) => r.lo !== r.hi && !(COMMON.has(r.lo) && COMMON.has(r.hi))),
);

const NUM = String.raw`(-?(?:\d[\d_]*\.?\d*|\.\d+)(?:e[+-]?\d+)?)`;
const GAP = String.raw`[^\n"'{}\`]{0,40}?`;
const PAIR_PATTERNS = [
  new RegExp(String.raw`\bmin\w*\s*[:=(]\s*${NUM}(?![\w.])${GAP}\bmax\w*\s*[:=(]\s*${NUM}(?![\w.])`, "gi"),
  new RegExp(String.raw`\bbetween\s+${NUM}(?![\w.])\s+(?:[^\s\d]\S*\s+)?and\s+${NUM}(?![\w.])`, "gi"),
];
const same = (a: number, b: number) => a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));

function sourceFiles(dir: string, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const p = path.join(dir, name);
    if (statSync(p).isDirectory()) sourceFiles(p, out);
    else if (/\.tsx?$/.test(name)) out.push(path.relative(ROOT, p));
  }
  return out;
}

/** Every range written in a line of code: its two numbers and the text that wrote them. */
function writtenRanges(line: string): { lo: number; hi: number; text: string }[] {
  const code = line.trim();
  if (code.startsWith("*") || code.startsWith("//") || code.startsWith("/*")) return [];
  return PAIR_PATTERNS.flatMap((re) => [...code.matchAll(re)].map((m) => ({ lo: Number(m[1].replace(/_/g, "")), hi: Number(m[2].replace(/_/g, "")), text: m[0] })));
}

function copiesIn(files: string[]): string[] {
  const found: string[] = [];
  for (const file of files) {
    readFileSync(path.join(ROOT, file), "utf8").split("\n").forEach((line, i) => {
      for (const w of writtenRanges(line)) {
        for (const r of ranges) {
          if (!same(w.lo, r.lo) || !same(w.hi, r.hi)) continue;
          if (ALLOWED.some((a) => a.file === file && same(a.range[0], w.lo) && same(a.range[1], w.hi))) continue;
          found.push(`${file}:${i + 1} writes the range of ${r.field} again: ${w.text}`);
        }
      }
    });
  }
  return found;
}

describe("each population, buffer and device range lives in its field table only", () => {
  it("finds no second copy of a field's bounds in lib/, components/ or app/", () => {
    const files = ["lib", "components", "app"].flatMap((d) => sourceFiles(path.join(ROOT, d))).filter((f) => !TABLES.includes(f));
    expect(copiesIn(files)).toEqual([]);
  });

  it("would notice a copy: the tables themselves are found by the same search", () => {
    expect(copiesIn(TABLES).length).toBeGreaterThan(10);
    expect(writtenRanges(`radius: quantity({ what: "r", min: 1e-7, max: 1e-4 }),`)).toEqual([{ lo: 1e-7, hi: 1e-4, text: "min: 1e-7, max: 1e-4" }]);
    expect(writtenRanges(`  z.number().min(0).max(60),`)).toHaveLength(1);
    expect(writtenRanges(` * @example between 0.1 and 100`)).toEqual([]);
  });
});
