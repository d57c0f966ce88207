import type { Knex } from "knex";
import { db } from "@/db/knex";
import { renderMail } from "./render";

/** One message to queue. `dedupeKey` makes a second enqueue of the same notification a no-op. */
export interface OutgoingMail {
  to: string;
  kind: string;
  template: string;
  vars: Record<string, string>;
  dedupeKey: string;
}

/**
 * Writes a message into mail_outbox inside the caller's transaction (transactional outbox).
 * @example await enqueueMail(trx, { to, kind: "signed-off", template: "signed-off", vars, dedupeKey: `signoff:${id}:${to}` });
 */
export async function enqueueMail(trx: Knex | Knex.Transaction, mail: OutgoingMail): Promise<void> {
  const rendered = renderMail(mail.template, mail.vars);
  await trx("mail_outbox")
    .insert({
      to_address: mail.to,
      subject: rendered.subject,
      body_text: rendered.text,
      body_html: rendered.html,
      kind: mail.kind,
      dedupe_key: mail.dedupeKey,
    })
    .onConflict("dedupe_key")
    .ignore();
}

/** A queued or sent message, for the mail page and tests. */
export interface OutboxEntry {
  id: number;
  to: string;
  subject: string;
  kind: string;
  status: string;
  attempts: number;
  lastError: string | null;
  createdAt: Date;
  sentAt: Date | null;
}

/** Lists outbox rows, newest first. @example await listOutbox(50) */
export async function listOutbox(limit = 100): Promise<OutboxEntry[]> {
  const rows = await db("mail_outbox").orderBy("id", "desc").limit(limit);
  return rows.map((r) => ({
    id: Number(r.id),
    to: r.to_address,
    subject: r.subject,
    kind: r.kind,
    status: r.status,
    attempts: Number(r.attempts),
    lastError: r.last_error,
    createdAt: new Date(r.created_at),
    sentAt: r.sent_at ? new Date(r.sent_at) : null,
  }));
}
