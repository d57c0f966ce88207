import { findCredentialsByEmail } from "@/lib/users/repo";
import { approveVersion } from "@/lib/protocols/review";
import { createProtocol, newVersion, submitVersion, updateDraft, type Actor } from "@/lib/protocols/service";
import { yeastProtocolContent } from "./protocol-content";
import { releaseDb } from "@/tests/e2e/support/db";

/**
 * Test-only set-up for the review journey, run from the Playwright process against the e2e database (same env as the
 * app): a protocol whose version 1 is approved and whose version 2 is a draft with a re-planned operating point.
 * Uses the service directly (so every row has its audit events), not a seed file.
 */
export async function approvedProtocolWithDraft(opts: { title: string; author: string; signer: string; password: string }) {
  const author = await actor(opts.author);
  const signer = await actor(opts.signer);
  const { protocol, version: v1 } = await createProtocol(author, {
    title: opts.title,
    purpose: "Remove heat-killed yeast before the viability count (test data).",
    codePrefix: "JRN",
    content: yeastProtocolContent(),
  });
  const sub = await submitVersion(author, { versionId: v1.id, lockVersion: v1.lockVersion });
  await approveVersion(signer, { versionId: v1.id, lockVersion: sub.lockVersion, meaning: "Approved for bench use", password: opts.password });
  const v2 = await newVersion(author, protocol.id);
  const base = yeastProtocolContent();
  const result = base.plan.result as { windows: Record<string, unknown>[] };
  const replanned = yeastProtocolContent({
    selection: { ...base.selection, frequency: 6e6, voltageVpp: 9, voltageVrms: 3.2, predicted: { recovery: 0.93, purity: 0.96, deltaT: 0.25 } },
    plan: { ...base.plan, seed: 43, result: { windows: [{ ...result.windows[0], operatingPoint: { frequency: 6e6, conductivity: 0.0025 }, score: 0.85 }, result.windows[1]] } },
  });
  await updateDraft(author, { versionId: v2.id, lockVersion: v2.lockVersion, content: replanned });
  return { protocolId: protocol.id, code: protocol.code };
}

async function actor(email: string): Promise<Actor> {
  const found = await findCredentialsByEmail(email);
  if (!found) throw new Error(`Test set-up: no user ${email} in ${process.env.DB_NAME}; is the e2e database seeded?`);
  const { id, name, role } = found.user;
  return { id, email, name, role };
}

/** Closes the Playwright process's database pool. */
export async function closeJourneyDb(): Promise<void> {
  await releaseDb();
}
