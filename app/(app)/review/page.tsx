import type { Metadata } from "next";
import { QueueTable } from "@/components/review/queue-table";
import { requirePageUser } from "@/lib/auth/session";
import { reviewQueue } from "@/lib/protocols/queries";

export const metadata: Metadata = { title: "Review queue" };

export default async function ReviewPage() {
  const user = await requirePageUser("review.sign");
  const items = await reviewQueue(user);
  return (
    <div className="max-w-6xl space-y-5">
      <header>
        <h1>Review queue</h1>
        <p className="mt-1 text-ink-soft">
          Versions submitted for QA, oldest first. Open each one, compare it with the last approved version, then sign it off or return it.
          You cannot sign a version you authored or edited.
        </p>
      </header>
      <section className="card">
        <QueueTable items={items} />
      </section>
    </div>
  );
}
