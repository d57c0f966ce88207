import type { Knex } from "knex";
import type { Transporter } from "nodemailer";
import { db } from "@/db/knex";
import { renderMail } from "./render";
import { mailFrom } from "./transport";

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

/** Delay before the next attempt after `attempts` failures: 2^n × base, capped at 10 minutes. */
export function backoffMs(attempts: number, baseMs = Number(process.env.OUTBOX_BACKOFF_BASE_MS ?? 5_000)): number {
  return Math.min(baseMs * 2 ** Math.max(0, attempts - 1), 10 * 60_000);
}

/**
 * Sends the due messages once: rows are claimed with SELECT … FOR UPDATE SKIP LOCKED so several senders never
 * deliver the same row; a failure schedules a retry with backoff and loses nothing.
 * @example const { sent, failed } = await deliverDueMail(smtpTransport());
 */
export async function deliverDueMail(transport: Transporter, batch = 20): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  await db.transaction(async (trx) => {
    const rows = await trx("mail_outbox")
      .where({ status: "pending" })
      .andWhere("next_attempt_at", "<=", trx.fn.now(3))
      .orderBy("id")
      .limit(batch)
      .forUpdate()
      .skipLocked();
    for (const row of rows) {
      try {
        const info = await transport.sendMail({
          from: mailFrom(),
          to: row.to_address,
          subject: row.subject,
          text: row.body_text,
          html: row.body_html,
          headers: { "X-Sievewright-Outbox-Id": String(row.id) },
        });
        await trx("mail_outbox").where({ id: row.id }).update({
          status: "sent",
          attempts: row.attempts + 1,
          sent_at: trx.fn.now(3),
          message_id: info.messageId ?? null,
          last_error: null,
        });
        sent++;
      } catch (err) {
        const attempts = row.attempts + 1;
        await trx("mail_outbox")
          .where({ id: row.id })
          .update({
            attempts,
            last_error: String((err as Error).message ?? err).slice(0, 2000),
            next_attempt_at: new Date(Date.now() + backoffMs(attempts)),
          });
        failed++;
      }
    }
  });
  return { sent, failed };
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
