import { afterAll, describe, expect, it } from "vitest";
import { cellFitResponse, computeCrossoverFit, NDJSON } from "@/lib/characterisation/api";
import { closeFitPool, fitCellsInPool } from "@/lib/characterisation/pool";
import { CELLS_FIT_EXAMPLE, CROSSOVER_FIT_EXAMPLE } from "@/lib/api/fit-docs";
import { FittingInputError } from "@/lib/fitting/errors";
import { fitPopulationFromCells, type CommonSetup } from "@/lib/fitting";
import { InputError } from "@/lib/errors";

// The pool runs real worker threads (build/workers/cell-fit.mjs, bundled by scripts/build-workers.mjs); no database needed.
afterAll(() => closeFitPool());

const body = CELLS_FIT_EXAMPLE.body as CommonSetup & { cells: { id: string; radius: number; points: { frequency: number; value: number }[] }[] };
const { cells, ...common } = body;

describe("cell fits in worker threads", () => {
  it("give the same answer as fitting in this thread, with progress up to every cell", async () => {
    const progress: number[] = [];
    const pooled = await fitCellsInPool(cells, common, { onProgress: (d) => progress.push(d) });
    const local = fitPopulationFromCells(cells, common);
    expect(progress.at(-1)).toBe(cells.length);
    expect(pooled.cells.map((c) => c.fit?.parameters.map((p) => p.estimate))).toEqual(local.cells.map((c) => c.fit?.parameters.map((p) => p.estimate)));
    expect(pooled.spreads).toEqual(local.spreads);
  });

  it("keeps the event loop free while fitting many cells", async () => {
    const many = Array.from({ length: 200 }, (_, i) => ({ ...cells[i % cells.length], id: `c${i}` }));
    let ticks = 0;
    const timer = setInterval(() => ticks++, 5);
    await fitCellsInPool(many, common);
    clearInterval(timer);
    expect(ticks).toBeGreaterThan(3);
  });

  it("refuses a bad setup before starting, naming the field", async () => {
    await expect(fitCellsInPool(cells, { ...common, kind: "rotation-rate" })).rejects.toBeInstanceOf(FittingInputError);
  });
});

describe("the fit routes' logic", () => {
  it("fits the crossover example with the full model", () => {
    const fit = computeCrossoverFit(CROSSOVER_FIT_EXAMPLE.body);
    expect(fit.modelUsed.kind).toBe("shell");
    expect(fit.capacitance.confidenceInterval!.lower).toBeLessThan(0.01);
    expect(fit.capacitance.confidenceInterval!.upper).toBeGreaterThan(0.01);
    expect(() => computeCrossoverFit({ points: [{ conductivity: -1, crossoverFrequency: 1e4 }] })).toThrow(InputError);
  });

  it("streams progress lines and then the result as NDJSON", async () => {
    const req = new Request("http://x/api/v1/fits/cells", { method: "POST", headers: { "content-type": "application/json", accept: NDJSON }, body: JSON.stringify(CELLS_FIT_EXAMPLE.body) });
    const res = await cellFitResponse(req);
    expect(res.headers.get("content-type")).toBe(NDJSON);
    const lines = (await res.text()).trim().split("\n").map((l) => JSON.parse(l));
    expect(lines[0]).toMatchObject({ type: "progress", total: cells.length });
    expect(lines.at(-1).type).toBe("result");
    expect(lines.at(-1).result.spreads.length).toBe(3);
  });

  it("answers a bad body with an input error naming the cell field", async () => {
    const bad = { ...CELLS_FIT_EXAMPLE.body, cells: [{ id: "x", radius: -1, points: [] }] };
    const req = new Request("http://x/api/v1/fits/cells", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(bad) });
    await expect(cellFitResponse(req)).rejects.toMatchObject({ issues: expect.arrayContaining([expect.objectContaining({ path: expect.stringContaining("cells") })]) });
  });
});
