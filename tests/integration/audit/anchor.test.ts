import { execFile } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { checkAnchors, currentAnchor, parseAnchors } from "@/lib/audit/anchor";
import { GENESIS_HASH, hashEvent, hashedFromRow } from "@/lib/audit/hash";
import { verifyAuditChain } from "@/lib/audit/verify";
import { createUser } from "@/lib/users/service";
import { behindTheAppsBack, closeDb, db, freshSchema } from "../support/db";

/**
 * npm run audit:anchor / audit:verify --anchor: an anchor written down outside the database catches a rewrite of the
 * whole history after an edit (every later event re-hashed, so the chain itself is intact again), and a cut-back trail.
 */

const exec = promisify(execFile);
let dir = "";

async function cli(script: string, args: string[]): Promise<{ code: number; out: string; err: string }> {
  try {
    const { stdout, stderr } = await exec("node", ["--import", "tsx", script, ...args], { env: process.env });
    return { code: 0, out: stdout, err: stderr };
  } catch (e) {
    const x = e as { code: number; stdout: string; stderr: string };
    return { code: x.code, out: x.stdout, err: x.stderr };
  }
}

async function someEvents(prefix: string, n: number): Promise<void> {
  for (let i = 0; i < n; i++) await createUser(null, { email: `${prefix}${i}@example.test`, name: `${prefix} ${i}`, role: "technician", password: "integration-pass-1" });
}

/** Rewrites history as someone with full rights would: edits event `seq` and re-hashes it and every later event and the head. */
async function rewriteFrom(seq: number, summary: string): Promise<void> {
  await behindTheAppsBack("audit_events", async (m) => {
    const rows: Record<string, unknown>[] = await m("audit_events").orderBy("chain_seq");
    let prev = GENESIS_HASH;
    for (const row of rows) {
      const s = Number(row.chain_seq);
      if (s >= seq) {
        const next = { ...row, prev_hash: prev, summary: s === seq ? summary : row.summary };
        const hash = hashEvent(hashedFromRow(next));
        await m("audit_events").where({ id: row.id }).update({ prev_hash: prev, summary: next.summary, row_hash: hash });
        prev = hash;
      } else prev = String(row.row_hash);
    }
    await m("audit_chain_head").where({ id: 1 }).update({ last_hash: prev });
  });
}

describe("audit chain anchors", () => {
  beforeAll(async () => {
    await freshSchema();
    dir = mkdtempSync(path.join(tmpdir(), "sw-anchor-"));
  });
  afterAll(async () => {
    rmSync(dir, { recursive: true, force: true });
    await closeDb();
  });

  it("audit:anchor prints the head and appends it to the operator's file; audit:verify --anchor accepts it while the chain grows", async () => {
    await someEvents("anchor.a", 4);
    const file = path.join(dir, "anchors.txt");
    const first = await cli("scripts/audit-anchor.ts", [file]);
    expect(first.code, first.err).toBe(0);
    const head = await currentAnchor(db);
    expect(first.out.trim()).toBe(`sievewright-audit-anchor v1 seq=${head!.seq} id=${head!.id} hash=${head!.hash} at=${first.out.trim().split("at=")[1]}`);
    expect(head!.seq).toBe(4);
    await someEvents("anchor.b", 3);
    const second = await cli("scripts/audit-anchor.ts", [file]);
    expect(second.code).toBe(0);
    const anchors = parseAnchors(readFileSync(file, "utf8"));
    expect(anchors.map((a) => a.seq)).toEqual([4, 7]);
    expect(statSync(file).mode & 0o777).toBe(0o600);
    await someEvents("anchor.c", 2);
    expect(await checkAnchors(anchors, db)).toEqual([]);
    const verify = await cli("scripts/audit-verify.ts", ["--anchor", file]);
    expect(verify.code, verify.err).toBe(0);
    expect(verify.out).toContain("anchors: all 2 in");
  });

  it("a history rewritten from an edit onwards passes the chain check but fails the anchors taken after the edited event", async () => {
    const file = path.join(dir, "anchors.txt");
    await rewriteFrom(3, "Created by nobody at all");
    const chain = await verifyAuditChain(db);
    expect(chain.intact).toBe(true); // the rewrite is consistent: the chain alone cannot see it
    const mismatches = await checkAnchors(parseAnchors(readFileSync(file, "utf8")), db);
    expect(mismatches.map((m) => [m.anchor.seq, m.kind])).toEqual([
      [4, "rewritten"],
      [7, "rewritten"],
    ]);
    expect(mismatches[0].message).toMatch(/position 4 now holds event id \d+ with hash .* the history up to that point was rewritten/);
    const verify = await cli("scripts/audit-verify.ts", ["--anchor", file]);
    expect(verify.code).toBe(1);
    expect(verify.err).toContain("ANCHOR FAILED: anchor of");
    expect(verify.err).toContain("2 of 2 anchor(s)");
  });

  it("an anchor before the rewritten part still holds; a trail cut back below an anchor is reported as missing", async () => {
    await freshSchema();
    await someEvents("anchor.d", 3);
    const early = (await currentAnchor(db))!;
    await someEvents("anchor.e", 3);
    const late = (await currentAnchor(db))!;
    await rewriteFrom(5, "Edited after the early anchor");
    expect(await checkAnchors([early], db)).toEqual([]);
    expect((await checkAnchors([late], db))[0]).toMatchObject({ kind: "rewritten" });
    await behindTheAppsBack("audit_events", async (m) => {
      await m("audit_events").where("chain_seq", ">", 4).delete();
      const last = await m("audit_events").where({ chain_seq: 4 }).first("row_hash");
      await m("audit_chain_head").where({ id: 1 }).update({ last_seq: 4, last_hash: last.row_hash });
    });
    expect((await verifyAuditChain(db)).intact).toBe(true);
    const [cut] = await checkAnchors([early, late], db);
    expect(cut).toMatchObject({ kind: "missing", anchor: { seq: 6 } });
    expect(cut.message).toContain("the trail was cut back");
  });

  it("refuses to anchor a broken chain, and a damaged anchor file is an error (exit 2), not 'no anchors'", async () => {
    await freshSchema();
    await someEvents("anchor.f", 3);
    const bad = path.join(dir, "bad.txt");
    writeFileSync(bad, "# anchors\nsievewright-audit-anchor v1 seq=1 id=1 hash=zz at=now\n");
    const damaged = await cli("scripts/audit-verify.ts", ["--anchor", bad]);
    expect(damaged.code).toBe(2);
    expect(damaged.err).toContain("Anchor file line 2 is not an anchor");
    await behindTheAppsBack("audit_events", (m) => m("audit_events").where({ chain_seq: 2 }).update({ summary: "edited" }));
    const refused = await cli("scripts/audit-anchor.ts", [path.join(dir, "never.txt")]);
    expect(refused.code).toBe(1);
    expect(refused.err).toContain("not anchoring it");
  });
});
