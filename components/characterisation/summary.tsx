import { PARAMETER_INFO, type FitParameterName } from "@/lib/fitting";
import { formatIn, type UnitId } from "@/lib/units/lab";

const UNIT: Record<FitParameterName | "radius", UnitId> = { membraneCapacitance: "uF_cm2", membraneConductance: "S_m2", cytoplasmConductivity: "S_m", cytoplasmPermittivity: "rel", radius: "um" };

interface StoredSpread {
  name: FitParameterName | "radius";
  mean: number;
  cv: number;
  n: number;
  distribution: "normal" | "lognormal";
}

/** The stored report of a characterisation from single-cell spectra, shown on the fitted version. */
export function CellFitSummary({ fit, dataFileHref, dataFileName }: { fit: Record<string, unknown>; dataFileHref: string | null; dataFileName: string | null }) {
  const spreads = (fit.spreads as StoredSpread[] | undefined) ?? [];
  const cells = (fit.cells as { id: string; included: boolean; outlier: boolean }[] | undefined) ?? [];
  const setup = fit.setup as { fieldDescription?: string } | undefined;
  return (
    <div className="space-y-2 text-sm" data-testid="fit-summary">
      <ul className="space-y-1">
        {spreads.map((s) => (
          <li key={s.name}>
            <strong>{s.name === "radius" ? "Radius" : PARAMETER_INFO[s.name].label.replace(/^./, (c) => c.toUpperCase())}</strong> {formatIn(UNIT[s.name], s.mean, 3)}, CV {formatIn("percent", s.cv, 2)}, {s.distribution === "lognormal" ? "log-normal" : "normal"}, n = {s.n}
          </li>
        ))}
        <li>{cells.filter((c) => c.included).length} of {cells.length} cells included ({cells.filter((c) => c.outlier).length} flagged); {String(fit.valueColumn ?? "")}{setup?.fieldDescription ? `; ${setup.fieldDescription}` : ""}</li>
      </ul>
      <p className="text-xs text-ink-muted">{String(fit.intervalNote ?? "")}</p>
      {dataFileHref && <p><a href={dataFileHref} download>Download the data file “{dataFileName}”</a></p>}
    </div>
  );
}
