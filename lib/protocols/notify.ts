import { readEnv } from "@/lib/env";
import type { Knex } from "knex";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { formatDateTime } from "@/lib/format/time";
import { formatConductivity, formatFrequency, formatVpp } from "@/lib/units/format";
import { enqueueMail } from "@/lib/mail/outbox";
import { listActiveUsersByRole, findUserById } from "@/lib/users/repo";
import type { Protocol, ProtocolVersion } from "./mapper";

/**
 * Notifications of the review cycle, written to mail_outbox inside the caller's transaction (so a rolled-back change
 * sends nothing). Dedupe keys name the version, the event (with the lock version for events that can repeat) and the
 * recipient.
 */

type Trx = Knex.Transaction;

/**
 * Link to a version page (APP_BASE_URL, no trailing slash).
 * @example versionLink(3, 2) // "http://127.0.0.1:3000/protocols/3/versions/2"
 */
export function versionLink(protocolId: number, number: number): string {
  const base = readEnv().APP_BASE_URL;
  return `${base}/protocols/${protocolId}/versions/${number}`;
}

function operatingPoint(v: ProtocolVersion): string {
  const s = v.content?.selection;
  if (!s) return "not recorded";
  return `${formatFrequency(s.frequency)} at ${formatConductivity(s.conductivity)}, ${formatVpp(s.voltageVpp)}`;
}

function common(p: Protocol, v: ProtocolVersion) {
  return { code: p.code, title: p.title, version: String(v.number), link: versionLink(p.id, v.number), hash: v.contentHash };
}

/** Submission → every active QA reviewer. `eventLock` is the lock version after the submission. */
export async function notifySubmitted(trx: Trx, p: Protocol, v: ProtocolVersion, author: { name: string }, eventLock: number): Promise<number> {
  const reviewers = await listActiveUsersByRole("reviewer", trx);
  for (const r of reviewers) {
    await enqueueMail(trx, {
      to: r.email,
      kind: "version-submitted",
      template: "version-submitted",
      vars: { ...common(p, v), author: author.name, operatingPoint: operatingPoint(v) },
      dedupeKey: `pv:${v.id}:submitted:${eventLock}:${r.email}`,
    });
  }
  return reviewers.length;
}

/** Return → the author, with the reviewer's comment. */
export async function notifyReturned(trx: Trx, p: Protocol, v: ProtocolVersion, reviewer: { name: string }, comment: string, eventLock: number): Promise<void> {
  const author = await findUserById(v.authorId, trx);
  if (!author || !author.active) return;
  await enqueueMail(trx, {
    to: author.email,
    kind: "version-returned",
    template: "version-returned",
    vars: { ...common(p, v), reviewer: reviewer.name, comment },
    dedupeKey: `pv:${v.id}:returned:${eventLock}:${author.email}`,
  });
}

/** Sign-off → every active supervisor and the author. */
export async function notifyApproved(
  trx: Trx,
  p: Protocol,
  v: ProtocolVersion,
  signature: { signerName: string; signerRole: Role; meaning: string; signedAt: Date },
  supersededNumbers: number[],
): Promise<string[]> {
  const supervisors = await listActiveUsersByRole("supervisor", trx);
  const author = await findUserById(v.authorId, trx);
  const recipients = [...new Set([...supervisors.map((s) => s.email), ...(author?.active ? [author.email] : [])])];
  const supersedes = supersededNumbers.length
    ? `It supersedes version ${supersededNumbers.join(", ")}, which may no longer be used at the bench.`
    : "It is the first approved version of this protocol.";
  for (const to of recipients) {
    await enqueueMail(trx, {
      to,
      kind: "version-approved",
      template: "version-approved",
      vars: {
        ...common(p, v),
        signer: signature.signerName,
        signerRole: ROLE_LABELS[signature.signerRole],
        meaning: signature.meaning,
        signedAt: formatDateTime(signature.signedAt),
        supersedes,
      },
      dedupeKey: `pv:${v.id}:approved:${to}`,
    });
  }
  return recipients;
}
