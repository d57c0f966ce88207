import type { Metadata } from "next";
import { QueueTable } from "@/components/review/queue-table";
import { can } from "@/lib/auth/roles";
import { requirePageUser } from "@/lib/auth/session";
import { reviewQueue } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  const user = await requirePageUser("review.read");
  const items = await reviewQueue(user);
  const signs = can(user.role, "review.sign");
  return (
    <div className="max-w-6xl space-y-5">
      <header>
        <h1>Review queue</h1>
        {signs ? (
          <p className="mt-1 text-ink-soft">
            Versions submitted for QA, oldest first. Open each one, compare it with the last approved version, then sign it off or return it.
            You cannot sign a version you authored or edited.
          </p>
        ) : (
          <p className="mt-1 text-ink-soft" data-testid="read-only-note">
            Versions submitted for QA, oldest first. You see the queue read-only: QA reviewers sign off or return versions.
          </p>
        )}
      </header>
      <section className="card">
        <QueueTable items={items} canSign={signs} />
      </section>
    </div>
  );
}
