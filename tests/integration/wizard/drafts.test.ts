import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { NotFoundError, TooLargeError } from "@/lib/errors";
import { defaultBuffer } from "@/lib/wizard/buffer-form";
import { defaultDevice } from "@/lib/wizard/device-form";
import { defaultLimits } from "@/lib/wizard/limits-form";
import { completedSteps } from "@/lib/wizard/progress";
import { saveAsProtocol } from "@/lib/wizard/drafts/save-as-protocol";
import { discardDraft, getOwnDraft, listOwnDrafts, MAX_DRAFT_BYTES, saveStepInputs, startDraft } from "@/lib/wizard/drafts/service";
import { STARTING_POINTS } from "@/lib/wizard/starting-points";
import { protocolContentSchema } from "@/lib/protocols/content";
import { createUser } from "@/lib/users/service";
import { closeDb, db, freshSchema } from "../support/db";

describe("planner wizard drafts", () => {
  let dana = { id: 0, email: "dana.wiz@example.test", name: "Dana Wiz", role: "developer" as const };
  let lee = { id: 0, email: "lee.wiz@example.test", name: "Lee Wiz", role: "developer" as const };

  beforeAll(async () => {
    await freshSchema();
    dana = { ...dana, id: (await createUser(null, { email: dana.email, name: dana.name, role: "developer", password: "developer-pass-1" })).id };
    lee = { ...lee, id: (await createUser(null, { email: lee.email, name: lee.name, role: "developer", password: "developer-pass-2" })).id };
  });
  afterAll(closeDb);

  it("keeps every step's inputs on the server and resumes at the step last left", async () => {
    const draft = await startDraft(dana);
    expect(draft.currentStep).toBe("populations");
    const live = STARTING_POINTS.find((s) => s.key === "mammalianViable")!.values;
    const dead = STARTING_POINTS.find((s) => s.key === "mammalianCompromised")!.values;
    await saveStepInputs(dana, draft.id, "populations", { target: live, other: dead }, "buffer", "Live vs dead");
    const after = await saveStepInputs(dana, draft.id, "buffer", defaultBuffer(), "device");
    expect(after.lockVersion).toBe(draft.lockVersion + 2);
    const again = await getOwnDraft(dana, draft.id);
    expect(again.title).toBe("Live vs dead");
    expect(again.currentStep).toBe("device");
    expect(again.inputs.populations).toEqual(JSON.parse(JSON.stringify({ target: live, other: dead })));
    expect(completedSteps(again.inputs)).toEqual(["populations", "buffer"]);
    expect((await listOwnDrafts(dana)).map((d) => d.id)).toContain(draft.id);
  });

  it("keeps drafts private to their owner", async () => {
    const draft = await startDraft(dana);
    await expect(getOwnDraft(lee, draft.id)).rejects.toBeInstanceOf(NotFoundError);
    await expect(saveStepInputs(lee, draft.id, "buffer", defaultBuffer())).rejects.toBeInstanceOf(NotFoundError);
    expect((await listOwnDrafts(lee)).map((d) => d.id)).not.toContain(draft.id);
    await expect(discardDraft(lee, draft.id)).rejects.toBeInstanceOf(NotFoundError);
  });

  it("refuses an oversized inputs document and deletes a discarded draft", async () => {
    const draft = await startDraft(dana);
    await expect(saveStepInputs(dana, draft.id, "save", { notes: "x".repeat(MAX_DRAFT_BYTES) })).rejects.toBeInstanceOf(TooLargeError);
    await discardDraft(dana, draft.id);
    expect(await db("wizard_drafts").where({ id: draft.id }).first()).toBeUndefined();
  });

  it("saves the selected window as protocol version 1 with the full, valid content", async () => {
    const draft = await startDraft(dana);
    const live = STARTING_POINTS.find((s) => s.key === "mammalianViable")!.values;
    const dead = STARTING_POINTS.find((s) => s.key === "mammalianCompromised")!.values;
    await saveStepInputs(dana, draft.id, "populations", { target: live, other: dead });
    await saveStepInputs(dana, draft.id, "buffer", defaultBuffer());
    await saveStepInputs(dana, draft.id, "device", defaultDevice());
    await saveStepInputs(dana, draft.id, "limits", defaultLimits());
    const { planWindows } = await import("@/lib/planner");
    const { readyInputs, toWindowsRequest } = await import("@/lib/wizard/request");
    const ready = readyInputs((await getOwnDraft(dana, draft.id)).inputs);
    if (!ready.ok) throw new Error(ready.message);
    const w = planWindows(toWindowsRequest(ready)).windows[0];
    expect(w).toBeDefined();
    await saveStepInputs(dana, draft.id, "results", { rank: w.rank, window: { conductivity: w.conductivity, bandStart: w.bandStart, bandStop: w.bandStop } });
    const saved = await saveAsProtocol(dana, draft.id, { title: "Wizard live/dead test", purpose: "Integration test of the save step.", destination: "new", protocolId: null, washes: 2, resuspensionMillionsPerMl: 5, notes: "" });
    expect(saved.versionNumber).toBe(1);
    const row = await db("protocol_versions").where({ id: saved.versionId }).first();
    expect(row.state).toBe("draft");
    const content = protocolContentSchema.parse(typeof row.content_json === "string" ? JSON.parse(row.content_json) : row.content_json);
    expect(content.selection.band).toEqual({ low: w.bandStart, high: w.bandStop });
    expect(content.plan.seed).toBe(ready.ok ? toWindowsRequest(ready).seed : -1);
    expect(content.selection.behaviour.target.length).toBeGreaterThan(5);
    expect((await getOwnDraft(dana, draft.id)).savedProtocolId).toBe(saved.protocolId);
  });
});
