import type { Knex } from "knex";

/**
 * Outbox claims: a sender claims due rows in a short transaction (claim_token + claimed_until), commits, sends over
 * SMTP outside any transaction, then marks the row sent only if its claim is still the one it holds. A crashed
 * sender's claims expire at claimed_until and are claimed again by another sender.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable("mail_outbox", (t) => {
    t.string("claim_token", 36).nullable();
    t.timestamp("claimed_until", { precision: 3 }).nullable();
    t.index(["claim_token"]);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable("mail_outbox", (t) => {
    t.dropIndex(["claim_token"]);
    t.dropColumn("claimed_until");
    t.dropColumn("claim_token");
  });
}
