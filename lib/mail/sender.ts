import { readEnv } from "@/lib/env";
import { randomUUID } from "node:crypto";
import type { Transporter } from "nodemailer";
import { db } from "@/db/knex";
import { redactPasswordLinks } from "@/lib/users/link-redaction";
import { mailFrom } from "./transport";

/**
 * The outbox sender. Rows are claimed in a short transaction (SELECT … FOR UPDATE SKIP LOCKED, then a claim token and
 * a lease), the transaction commits, and only then is SMTP spoken — so a slow or silent mail server never holds a
 * database lock that the lifecycle's own outbox inserts would wait for. Each row is re-confirmed just before it is sent
 * (the lease is renewed only while this claim still owns it) and marked sent only under the same claim token, so one
 * claim sends a message at most once; a crashed sender's claims expire and another sender takes them over.
 */

/** A set of rows this sender owns until the lease runs out. */
export interface Claim {
  token: string;
  rows: OutboxRow[];
}

interface OutboxRow {
  id: number;
  to_address: string;
  subject: string;
  body_text: string;
  body_html: string;
  attempts: number;
}

/** Options of one delivery pass (milliseconds). */
export interface SenderOptions {
  /** How many rows to claim at once. */
  batch?: number;
  /** How long a claim (and each renewal before a send) lasts; must exceed sendDeadlineMs. */
  leaseMs?: number;
  /** Hard upper bound on one SMTP send, on top of the transport's own connection/greeting/socket time-outs. */
  sendDeadlineMs?: number;
}

/** Attempts after which a message is given up (status "failed", kept with its last error). */
export const MAX_ATTEMPTS = readEnv().OUTBOX_MAX_ATTEMPTS;

const DEFAULT_LEASE_MS = readEnv().OUTBOX_LEASE_MS;
const DEFAULT_SEND_DEADLINE_MS = readEnv().OUTBOX_SEND_DEADLINE_MS;

/** Delay before the next attempt after `attempts` failures: 2^(n-1) × base, capped at 10 minutes. @example backoffMs(3, 5000) // 20000 */
export function backoffMs(attempts: number, baseMs = readEnv().OUTBOX_BACKOFF_BASE_MS): number {
  return Math.min(baseMs * 2 ** Math.max(0, attempts - 1), 10 * 60_000);
}

const leaseUntil = (ms: number) => db.raw("NOW(3) + INTERVAL ? MICROSECOND", [Math.round(ms * 1000)]);

/**
 * Claims up to `batch` due rows (pending, due, and not under a live claim) for `leaseMs`, in one short transaction.
 * @example const claim = await claimDueMail({ batch: 20, leaseMs: 120_000 }); // claim.rows.length ≤ 20
 */
export async function claimDueMail(opts: SenderOptions = {}): Promise<Claim> {
  const token = randomUUID();
  const batch = opts.batch ?? 20;
  const leaseMs = opts.leaseMs ?? DEFAULT_LEASE_MS;
  await retryOnDeadlock(() => db.transaction(async (trx) => {
    const due = await trx("mail_outbox")
      .select("id")
      .where({ status: "pending" })
      .andWhere("next_attempt_at", "<=", trx.fn.now(3))
      .andWhere((q) => q.whereNull("claimed_until").orWhere("claimed_until", "<", trx.fn.now(3)))
      .orderBy("id")
      .limit(batch)
      .forUpdate()
      .skipLocked();
    if (due.length === 0) return;
    await trx("mail_outbox")
      .whereIn("id", due.map((r) => r.id))
      .update({ claim_token: token, claimed_until: leaseUntil(leaseMs) });
  }));
  const rows = await db("mail_outbox")
    .select("id", "to_address", "subject", "body_text", "body_html", "attempts")
    .where({ claim_token: token, status: "pending" })
    .orderBy("id");
  return { token, rows: rows.map((r) => ({ ...r, id: Number(r.id), attempts: Number(r.attempts) })) };
}

/**
 * Sends the rows of a claim one by one, outside any transaction. A row whose claim was lost (lease expired and
 * another sender took it) is skipped, never sent again under this claim.
 * @example const { sent, failed, skipped } = await sendClaimed(smtpTransport(), claim);
 */
export async function sendClaimed(transport: Transporter, claim: Claim, opts: SenderOptions = {}): Promise<{ sent: number; failed: number; skipped: number }> {
  const leaseMs = opts.leaseMs ?? DEFAULT_LEASE_MS;
  const deadlineMs = Math.min(opts.sendDeadlineMs ?? DEFAULT_SEND_DEADLINE_MS, leaseMs / 2);
  let sent = 0;
  let failed = 0;
  let skipped = 0;
  for (const row of claim.rows) {
    const mine = () => db("mail_outbox").where({ id: row.id, claim_token: claim.token, status: "pending" });
    const renewed = await retryOnDeadlock(() =>
      mine().andWhere("claimed_until", ">", db.fn.now(3)).update({ claimed_until: leaseUntil(leaseMs) }),
    );
    if (renewed !== 1) {
      skipped++;
      continue;
    }
    try {
      const info = await withDeadline(
        transport.sendMail({
          from: mailFrom(),
          to: row.to_address,
          subject: row.subject,
          text: row.body_text,
          html: row.body_html,
          headers: { "X-Sievewright-Outbox-Id": String(row.id) },
        }),
        deadlineMs,
      );
      await retryOnDeadlock(() => mine().update({
        ...withoutLinkTokens(row),
        status: "sent",
        attempts: row.attempts + 1,
        sent_at: db.fn.now(3),
        message_id: info.messageId ?? null,
        last_error: null,
        claim_token: null,
        claimed_until: null,
      }));
      sent++;
    } catch (err) {
      const attempts = row.attempts + 1;
      await retryOnDeadlock(() => mine().update({
        ...(attempts >= MAX_ATTEMPTS ? withoutLinkTokens(row) : {}),
        status: attempts >= MAX_ATTEMPTS ? "failed" : "pending",
        attempts,
        last_error: String((err as Error)?.message ?? err).slice(0, 2000),
        next_attempt_at: new Date(Date.now() + backoffMs(attempts)),
        claim_token: null,
        claimed_until: null,
      }));
      failed++;
    }
  }
  return { sent, failed, skipped };
}

/**
 * The stored bodies once a message is done with (sent, or given up): set-password and reset link tokens withheld, so
 * mail_outbox never keeps a working link after the one delivery that needed it.
 */
function withoutLinkTokens(row: OutboxRow): { body_text: string; body_html: string } {
  return { body_text: redactPasswordLinks(row.body_text), body_html: redactPasswordLinks(row.body_html) };
}

/**
 * One delivery pass: claim the due rows, commit, send them. Several senders (processes or app instances) may run at
 * once; none ever waits on another's SMTP conversation.
 * @example const { sent, failed } = await deliverDueMail(smtpTransport());
 */
export async function deliverDueMail(transport: Transporter, opts: SenderOptions = {}): Promise<{ sent: number; failed: number; skipped: number }> {
  const claim = await claimDueMail(opts);
  if (claim.rows.length === 0) return { sent: 0, failed: 0, skipped: 0 };
  return sendClaimed(transport, claim, opts);
}

/**
 * Runs one statement (or short transaction) again when InnoDB picks it as a deadlock victim or its lock wait times out
 * (errno 1213 / 1205): two senders claiming and renewing rows of the same table can meet on an index lock. Each retry
 * repeats the whole statement, whose WHERE clause still names the claim, so a retry never widens what it touches.
 */
async function retryOnDeadlock<T>(work: () => PromiseLike<T>, tries = 4): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (err) {
      const errno = (err as { errno?: number }).errno;
      if ((errno !== 1213 && errno !== 1205) || attempt >= tries) throw err;
      await new Promise((resolve) => setTimeout(resolve, 20 * attempt + Math.random() * 30));
    }
  }
}

function withDeadline<T>(work: Promise<T>, ms: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const deadline = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`SMTP send did not finish within ${Math.round(ms / 1000)} s`)), ms);
  });
  return Promise.race([work, deadline]).finally(() => clearTimeout(timer));
}
