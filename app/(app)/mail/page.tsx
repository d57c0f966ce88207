import { readEnv } from "@/lib/env";
import type { Metadata } from "next";
import { CapturedList } from "@/components/mail/captured-list";
import { OutboxTable } from "@/components/mail/outbox-table";
import { requirePageUser } from "@/lib/auth/session";
import { listOutbox } from "@/lib/mail/outbox";
import { readCapturedMail } from "@/lib/mail/sink";

export const metadata: Metadata = { title: "Mail" };
export const dynamic = "force-dynamic";

/** Whether mail goes to the local sink (loopback SMTP with a capture folder) rather than a real relay. */
function sinkDir(): string | null {
  const { SMTP_HOST: host, MAIL_SINK_DIR: dir } = readEnv();
  return dir && (host === "127.0.0.1" || host === "localhost") ? dir : null;
}

export default async function MailPage() {
  await requirePageUser("mail.read");
  const rows = await listOutbox(200);
  const dir = sinkDir();
  const captured = dir ? readCapturedMail(dir).slice(0, 100) : null;
  return (
    <div className="max-w-6xl space-y-5">
      <header>
        <h1>Mail</h1>
        <p className="mt-1 text-ink-soft">Notifications are queued in the same transaction as the change they report, then delivered by the outbox sender with retries; an SMTP outage delays mail and loses none.</p>
      </header>
      <section className="card">
        <h2 className="mb-3">Outbox</h2>
        <OutboxTable rows={rows} />
      </section>
      {captured && (
        <section className="card">
          <h2 className="mb-1">Captured by the local mail sink</h2>
          <p className="hint mb-3">Development and test only: the loopback SMTP sink keeps every message instead of sending it on.</p>
          <CapturedList messages={captured} />
        </section>
      )}
    </div>
  );
}
