import { ConflictError, InputError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { planWindows } from "@/lib/planner";
import { createProtocol, newVersion, updateDraft } from "@/lib/protocols/service";
import type { Role } from "@/lib/auth/roles";
import { buildContent } from "../to-protocol";
import { readyInputs, toWindowsRequest } from "../request";
import { saveStepSchema } from "../save-form";
import { getOwnDraft, markSaved, saveStepInputs } from "./service";

/** The chosen window as the results step stored it. */
interface StoredSelection {
  rank?: number;
  window?: { conductivity: number; bandStart: number; bandStop: number } | null;
}

/**
 * Saves a planner draft as a protocol draft: recomputes the plan on the server with the stored seed (so the saved
 * result is exactly reproducible), finds the selected window, builds the protocol content and creates protocol
 * version 1 or a new version of an existing protocol.
 * @example const { protocolId, versionNumber } = await saveAsProtocol(dana, 12, { title: "…", purpose: "…", destination: "new", … });
 */
export async function saveAsProtocol(actor: { id: number; email: string; name: string; role: Role }, draftId: number, raw: unknown): Promise<{ protocolId: number; versionId: number; versionNumber: number; code: string }> {
  const form = parseOrThrow(saveStepSchema, raw);
  const draft = await getOwnDraft(actor, draftId);
  await saveStepInputs(actor, draftId, "save", raw as object, "save", form.title);
  const ready = readyInputs(draft.inputs);
  if (!ready.ok) throw new InputError([{ path: ready.step, message: `The ${ready.step} step is incomplete: ${ready.message}` }]);
  const sel = draft.inputs.results as StoredSelection | undefined;
  if (!sel?.window) throw new InputError([{ path: "results", message: "Select an operating window on the Results step before saving." }]);
  const request = toWindowsRequest(ready);
  const result = planWindows(request);
  const near = (a: number, b: number) => Math.abs(Math.log(a / b)) < 1e-6;
  const window = result.windows.find((w) => near(w.conductivity, sel.window!.conductivity) && near(w.bandStart, sel.window!.bandStart) && near(w.bandStop, sel.window!.bandStop));
  if (!window) throw new ConflictError("The selected window is no longer among the results (the inputs changed since it was chosen). Open the Results step and select a window again.");
  const flowRate = ready.device.drive === "flow" ? ready.device.flowRate : null;
  const content = buildContent({ ...ready, request, result, window, save: form, flowRateUlPerMin: flowRate });
  if (form.destination === "new") {
    const { protocol, version } = await createProtocol(actor, { title: form.title, purpose: form.purpose, content });
    await markSaved(actor, draftId, { protocolId: protocol.id, versionId: version.id, title: form.title });
    return { protocolId: protocol.id, versionId: version.id, versionNumber: version.number, code: protocol.code };
  }
  const started = await newVersion(actor, form.protocolId!);
  const version = await updateDraft(actor, { versionId: started.id, lockVersion: started.lockVersion, content });
  await markSaved(actor, draftId, { protocolId: form.protocolId!, versionId: version.id, title: form.title });
  return { protocolId: form.protocolId!, versionId: version.id, versionNumber: version.number, code: "" };
}
