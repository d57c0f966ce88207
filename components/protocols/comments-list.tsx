import { formatDateTime } from "@/lib/format/time";
import type { ReviewComment } from "@/lib/protocols/mapper";

/** Reviewers' comments on a version, oldest first. */
export function CommentsList({ comments }: { comments: ReviewComment[] }) {
  if (comments.length === 0) return <p className="text-sm text-ink-muted">No comments.</p>;
  return (
    <ul className="space-y-3">
      {comments.map((c) => (
        <li key={c.id} className={`rounded-md border p-3 text-sm ${c.kind === "return" ? "border-caution/40 bg-caution-light" : "border-paper-line bg-white"}`} data-testid="comment">
          <p className="text-xs text-ink-muted">{c.kind === "return" ? "Returned by" : "Note by"} {c.authorName} · {formatDateTime(c.createdAt)}</p>
          <p className="mt-1 whitespace-pre-wrap">{c.body}</p>
        </li>
      ))}
    </ul>
  );
}
