import { db } from "@/db/knex";
import { findVersion } from "@/lib/protocols/repo";
import { listRunsForVersion } from "@/lib/runs/repo";
import { ObservedChart } from "./observed-chart";
import { RunsTable } from "./runs-table";

/**
 * The runs recorded against a protocol version: predicted against observed recovery and purity, out-of-range
 * conductivity flags, and the list. A server component; the caller has already checked the viewer may see the version.
 */
export async function VersionRuns({ versionId }: { versionId: number }) {
  const [version, runs] = await Promise.all([findVersion(db, versionId), listRunsForVersion(versionId)]);
  if (!version) return null;
  const predicted = version.content.selection.predicted;
  const outOfRange = runs.filter((r) => !r.conductivityAccepted).length;
  const oldestFirst = [...runs].reverse();
  const points = oldestFirst.map((r, i) => ({ run: i + 1, recovery: r.observedRecovery, purity: r.observedPurity }));
  return (
    <section className="card space-y-4" data-testid="version-runs">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h2>Bench runs ({runs.length})</h2>
        {outOfRange > 0 && (
          <p className="text-sm text-danger" data-testid="runs-out-of-range">
            {outOfRange} run{outOfRange === 1 ? "" : "s"} measured a buffer conductivity outside the acceptance range.
          </p>
        )}
      </header>
      {points.some((p) => p.recovery !== null || p.purity !== null) && <ObservedChart points={points} predicted={predicted} />}
      <RunsTable runs={runs} />
    </section>
  );
}
