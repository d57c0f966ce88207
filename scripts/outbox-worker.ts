import { assertNoMigratorCredentials } from "../db/config";
import { db } from "../db/knex";
import { readEnv } from "../lib/env";
import { deliverDueMail } from "../lib/mail/sender";
import { smtpTransport } from "../lib/mail/transport";

/** The outbox sender: its own process, polling mail_outbox every OUTBOX_POLL_MS and delivering over SMTP. */
assertNoMigratorCredentials();
const pollMs = readEnv().OUTBOX_POLL_MS;
const transport = smtpTransport();
let stopping = false;

async function loop() {
  while (!stopping) {
    try {
      const { sent, failed } = await deliverDueMail(transport);
      if (sent || failed) console.log(`[outbox] sent ${sent}, deferred ${failed}`);
    } catch (err) {
      console.error(`[outbox] ${(err as Error).message}`);
    }
    await new Promise((r) => setTimeout(r, pollMs));
  }
  transport.close();
  await db.destroy();
}

const stop = () => {
  stopping = true;
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
console.log(`[outbox] polling every ${pollMs} ms`);
loop().then(() => process.exit(0));
