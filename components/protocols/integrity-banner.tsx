import type { Integrity } from "@/lib/protocols/integrity";

/** The hash check of a version: an unmissable error when content and signatures disagree, a quiet line otherwise. */
export function IntegrityBanner({ integrity, signed }: { integrity: Integrity; signed: boolean }) {
  if (!integrity.ok) {
    return (
      <section className="rounded-md border-2 border-danger bg-danger-light p-4 text-sm" data-testid="integrity-error">
        <h2 className="text-danger">Content does not match its record — do not use this version</h2>
        <ul className="mt-2 list-disc space-y-1 pl-5">
          {integrity.problems.map((p) => <li key={p}>{p}</li>)}
        </ul>
        <p className="mt-2">Report this to QA. The audit trail shows every change made through Sievewright.</p>
      </section>
    );
  }
  return (
    <p className="text-xs text-ink-muted" data-testid="integrity-ok">
      ✓ Content re-hashed on opening: SHA-256 <span className="font-mono">{integrity.computed}</span> matches the version record{signed ? " and every signature" : ""}.
    </p>
  );
}
