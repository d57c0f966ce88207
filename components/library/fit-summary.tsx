import { CellFitSummary } from "@/components/characterisation/summary";
import { formatIn } from "@/lib/units/lab";

interface StoredEstimate {
  estimate: number;
  fitted: boolean;
  confidenceInterval: { lower: number; upper: number } | null;
}

/** The stored result of a crossover fit, shown on a fitted version. */
export function FitSummary({ fit, dataFileHref, dataFileName }: { fit: Record<string, unknown>; dataFileHref: string | null; dataFileName: string | null }) {
  if (fit.kind === "cell-spectra") return <CellFitSummary fit={fit} dataFileHref={dataFileHref} dataFileName={dataFileName} />;
  const c = fit.capacitance as StoredEstimate | undefined;
  const g = fit.conductance as StoredEstimate | undefined;
  const warnings = (fit.warnings as { message: string }[] | undefined) ?? [];
  const dropped = (fit.droppedRows as number[] | undefined) ?? [];
  const ci = (e: StoredEstimate | undefined, unit: "uF_cm2" | "S_m2") =>
    e?.confidenceInterval ? `95 % CI ${formatIn(unit, e.confidenceInterval.lower, 3)} to ${formatIn(unit, e.confidenceInterval.upper, 3)}` : "no interval";
  return (
    <div className="space-y-2 text-sm" data-testid="fit-summary">
      <ul className="space-y-1">
        {c && <li><strong>Membrane capacitance</strong> {formatIn("uF_cm2", c.estimate, 3)} ({ci(c, "uF_cm2")})</li>}
        {g && <li><strong>Membrane conductance</strong> {g.fitted ? `${formatIn("S_m2", g.estimate, 3)} (${ci(g, "S_m2")})` : "held at 0 (not fitted)"}</li>}
        <li>{String(fit.pointCount ?? "?")} crossovers, {String(fit.degreesOfFreedom ?? "?")} degrees of freedom{dropped.length ? `; rows left out for errors: ${dropped.join(", ")}` : ""}</li>
      </ul>
      {warnings.length > 0 && <ul className="notice list-disc pl-8">{warnings.map((w, i) => <li key={i}>{w.message}</li>)}</ul>}
      {dataFileHref && <p><a href={dataFileHref} download>Download the data file “{dataFileName}”</a></p>}
    </div>
  );
}
