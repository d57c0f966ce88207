import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openWorkOf, recentRuns, versionStateCounts, versionsInUse } from "@/lib/dashboard/overview";
import { listAuthors, versionBenchStatus } from "@/lib/protocols/queries";
import { recordRun, type RunActor } from "@/lib/runs/service";
import { BENCH_CONTENT, insertBenchVersion, type InsertedVersion } from "@/tests/support/bench-fixture";
import { closeDb, db, freshSchema } from "../support/db";

/** The role home pages' figures, read through lib/protocols and lib/runs (no query of their own). */
describe("dashboard overview", () => {
  let approved: InsertedVersion;
  let draft: InsertedVersion;
  let inReview: InsertedVersion;
  let tech: RunActor;
  let devId: number;
  const run = { bufferLot: "B-0412", measuredAtC: "25", operatingTemperatureC: "22", frequencyKHz: "350", voltageVpp: "14.1", countingMethod: "haemocytometer" };

  beforeAll(async () => {
    await freshSchema();
    approved = await insertBenchVersion(db, { code: "QH-LYM-01", state: "approved" });
    draft = await insertBenchVersion(db, { code: "QH-LYM-01", state: "draft" });
    inReview = await insertBenchVersion(db, { code: "QH-LYM-02", state: "in_review", title: "Second clean-up" });
    const [tid] = await db("users").insert({ email: "tomas.tech@example.test", name: "Tomas Technician", role: "technician", password_hash: "x" });
    tech = { id: Number(tid), email: "tomas.tech@example.test", role: "technician" };
    devId = Number((await db("users").where({ email: "dana.dev@example.test" }).first("id")).id);
    // The fixture buffer accepts 90–110 µS/cm at 25 °C: 100 is inside, 150 outside.
    await recordRun(tech, { ...run, versionId: approved.versionId, conductivityUsPerCm: "100", purityPercent: "90" });
    await new Promise((resolve) => setTimeout(resolve, 20)); // distinct created_at for the newest-first order
    await recordRun(tech, { ...run, versionId: approved.versionId, conductivityUsPerCm: "150", purityPercent: "80" });
  });
  afterAll(closeDb);

  it("counts versions by state, and one author's open work", async () => {
    expect(await versionStateCounts()).toEqual({ approved: 1, draft: 1, in_review: 1 });
    expect(await openWorkOf(devId)).toEqual({ drafts: 1, returned: 0, inReview: 1 });
    expect(await openWorkOf(tech.id)).toEqual({ drafts: 0, returned: 0, inReview: 0 });
  });

  it("lists the approved version with its signer, run statistics and predicted purity", async () => {
    const [inUse, ...rest] = await versionsInUse();
    expect(rest).toEqual([]);
    expect(inUse).toMatchObject({ protocolId: approved.protocolId, code: "QH-LYM-01", versionId: approved.versionId, versionNumber: 1, signedBy: "Quinn Reviewer", runCount: 2, readingsOutOfRange: 1 });
    expect(inUse.meanObservedPurity).toBeCloseTo(0.85, 9); // hand: (0.90 + 0.80) / 2
    expect(inUse.predictedPurity).toBe(BENCH_CONTENT.selection.predicted.purity);
    expect(inUse.lastRunAt).toBeInstanceOf(Date);
  });

  it("lists recent runs newest first with their protocol code, version and technician", async () => {
    const runs = await recentRuns(10);
    expect(runs.map((r) => [r.code, r.versionNumber, r.technicianName, r.conductivityAccepted])).toEqual([
      ["QH-LYM-01", 1, "Tomas Technician", false],
      ["QH-LYM-01", 1, "Tomas Technician", true],
    ]);
    expect(await recentRuns(1)).toHaveLength(1);
  });

  it("says which versions are ready for the bench, and lists authors by name", async () => {
    expect((await versionBenchStatus(approved.versionId))?.benchReady).toBe(true);
    expect((await versionBenchStatus(draft.versionId))?.benchReady).toBe(false);
    expect((await versionBenchStatus(inReview.versionId))?.benchReady).toBe(false);
    expect(await versionBenchStatus(999_999)).toBeNull();
    expect(await listAuthors()).toEqual([{ id: devId, name: "Dana Developer" }]);
  });
});
