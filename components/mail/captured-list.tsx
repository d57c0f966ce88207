import { plainTextOf, subjectOf } from "@/lib/format/mime";
import { formatDateTime } from "@/lib/format/time";
import type { CapturedMail } from "@/lib/mail/sink";
import { redactPasswordLinks } from "@/lib/users/link-redaction";

/** Messages the local SMTP sink received (development and test only), newest first, with the plain-text body. */
export function CapturedList({ messages }: { messages: CapturedMail[] }) {
  if (messages.length === 0) return <p className="text-sm text-ink-muted">The sink has not received any message yet.</p>;
  return (
    <ul className="space-y-2" data-testid="captured-mail">
      {messages.map((m) => (
        <li key={m.id} className="rounded-md border border-paper-line">
          <details>
            <summary className="flex cursor-pointer flex-wrap gap-x-4 px-3 py-2 text-sm">
              <span className="font-medium">{subjectOf(m.raw) || m.subject}</span>
              <span className="text-ink-muted">to {m.to.join(", ")}</span>
              <span className="text-ink-muted">{formatDateTime(new Date(m.receivedAt))}</span>
            </summary>
            <pre className="whitespace-pre-wrap border-t border-paper-line bg-paper/60 p-3 text-xs">{redactPasswordLinks(plainTextOf(m.raw))}</pre>
          </details>
        </li>
      ))}
    </ul>
  );
}
