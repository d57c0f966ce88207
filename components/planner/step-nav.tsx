import Link from "next/link";
import { STEPS, type StepSlug } from "@/lib/wizard/steps";

/** The wizard's step list: where you are, which steps are done; every step is a link (URL per step). */
export function StepNav({ draftId, current, done }: { draftId: number; current: StepSlug; done: StepSlug[] }) {
  return (
    <nav aria-label="Planner steps" className="mb-6">
      <ol className="flex flex-wrap gap-2 text-sm">
        {STEPS.map((s, i) => {
          const isCurrent = s.slug === current;
          const isDone = done.includes(s.slug);
          return (
            <li key={s.slug}>
              <Link
                href={`/planner/${draftId}/${s.slug}`}
                aria-current={isCurrent ? "step" : undefined}
                className={`flex items-center gap-2 rounded-md border px-3 py-1.5 no-underline ${isCurrent ? "border-moss bg-moss text-white" : "border-paper-line bg-white text-ink hover:bg-paper-deep"}`}
              >
                <span aria-hidden="true" className={`inline-flex h-5 w-5 items-center justify-center rounded-full text-xs ${isCurrent ? "bg-white text-moss-dark" : isDone ? "bg-moss-light text-moss-dark" : "bg-paper-deep text-ink-soft"}`}>
                  {isDone && !isCurrent ? "✓" : i + 1}
                </span>
                {s.title}
                {isDone && <span className="sr-only"> (done)</span>}
              </Link>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
