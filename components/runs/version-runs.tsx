import { PrintForm } from "@/components/bench/print-form";
import { timed } from "@/lib/http/page-timing";
import type { ProtocolContent } from "@/lib/protocols/content";
import { listRunsForVersion } from "@/lib/runs/repo";
import { ObservedChartLazy } from "./observed-chart-lazy";
import { RunsTable } from "./runs-table";

/** What the runs section needs of the version its page has already read. */
export interface VersionForRuns {
  id: number;
  protocolId: number;
  number: number;
  content: Pick<ProtocolContent, "selection" | "buffer">;
}

/**
 * The bench side of a protocol version: its bench-sheet download, the runs recorded against it, predicted against
 * observed recovery and purity, and out-of-range conductivity flags. A server component; the caller has already
 * read the version (and checked that the viewer may see it and whether it is bench-ready: approved, signed, hash
 * intact), so only the runs are read here. `showPrint={false}` where the page has its own print form.
 */
export async function VersionRuns({ version, benchReady, showPrint = true }: { version: VersionForRuns; benchReady: boolean; showPrint?: boolean }) {
  const runs = await timed("runs", () => listRunsForVersion(version.id));
  const predicted = version.content.selection.predicted;
  const outOfRange = runs.filter((r) => !r.conductivityAccepted).length;
  const oldestFirst = [...runs].reverse();
  const points = oldestFirst.map((r, i) => ({ run: i + 1, recovery: r.observedRecovery, purity: r.observedPurity }));
  return (
    <section className="card space-y-4" data-testid="version-runs">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h2>Bench sheet and runs ({runs.length})</h2>
        {outOfRange > 0 && (
          <p className="text-sm text-danger" data-testid="runs-out-of-range">
            {outOfRange} run{outOfRange === 1 ? "" : "s"} measured a buffer conductivity outside the acceptance range.
          </p>
        )}
      </header>
      {showPrint && <PrintForm protocolId={version.protocolId} number={version.number} benchReady={benchReady} />}
      {points.some((p) => p.recovery !== null || p.purity !== null) && <ObservedChartLazy points={points} predicted={predicted} />}
      <RunsTable runs={runs} maxMinutesInBuffer={version.content.buffer.maxMinutesInBuffer} />
    </section>
  );
}
