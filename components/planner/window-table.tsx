import type { OperatingWindow } from "@/lib/planner";
import { formatConductivity, formatDecades, formatFrequency } from "@/lib/units/format";
import { sig } from "@/lib/units/number";

const pct = (x: number) => `${sig(x * 100, 3)} %`;

/** The ranked windows; each row's button selects it (moves the marker on both charts). */
export function WindowTable({ windows, selected, onSelect }: { windows: OperatingWindow[]; selected: number | null; onSelect: (rank: number) => void }) {
  return (
    <div className="overflow-x-auto">
      <table data-testid="window-table">
        <caption className="sr-only">Ranked operating windows</caption>
        <thead>
          <tr>
            <th scope="col">Rank</th><th scope="col">Band</th><th scope="col">Operating point and region</th><th scope="col">Voltage</th>
            <th scope="col">Recovery</th><th scope="col">Purity</th><th scope="col">ΔT</th><th scope="col">Warnings</th><th scope="col">Score (parts)</th>
          </tr>
        </thead>
        <tbody>
          {windows.map((w) => {
            const isSel = w.rank === selected;
            return (
              <tr key={w.rank} className={isSel ? "bg-moss-light/60" : "cursor-pointer hover:bg-paper-deep/60"} onClick={() => onSelect(w.rank)} data-testid="window-row" aria-selected={isSel}>
                <td>
                  <button type="button" className={isSel ? "btn px-2 py-1 text-xs" : "btn-quiet px-2 py-1 text-xs"} aria-pressed={isSel} onClick={(e) => { e.stopPropagation(); onSelect(w.rank); }}>
                    #{w.rank}{isSel ? " selected" : " select"}
                  </button>
                </td>
                <td>{formatFrequency(w.bandStart)} – {formatFrequency(w.bandStop)}<div className="hint">{formatDecades(w.widthDecades)} wide</div></td>
                <td>{formatFrequency(w.operatingPoint.frequency)} at {formatConductivity(w.operatingPoint.conductivity)}<div className="hint">target by {w.targetDirection}</div>{w.region && w.region.rows > 1 && <div className="hint" data-testid="window-region">region {formatConductivity(w.region.conductivityMin)} – {formatConductivity(w.region.conductivityMax)} ({w.region.rows} rows)</div>}</td>
                <td>{sig(w.voltage.vpp, 3)} Vpp ({sig(w.voltage.rms, 3)} Vrms)<div className="hint">{w.voltage.limitedBy === "speed" ? "set by the target speed" : `limited by ${w.voltage.limitedBy}`}</div></td>
                <td>{pct(w.recovery)}</td>
                <td>{pct(w.purity)}</td>
                <td>{sig(w.temperatureRise, 2)} K{w.heating?.array != null && <div className="hint">array; pair {sig(w.heating.isolatedPair, 2)} K</div>}</td>
                <td>{w.warnings.length === 0 ? "none" : `${w.warnings.length}: ${w.warnings.map((x) => x.code).join(", ")}`}</td>
                <td><span className="font-medium">{sig(w.score, 3)}</span><div className="hint">{w.scoreParts.map((p) => `${p.label} ${sig(p.contribution, 2)}`).join(" · ")}</div></td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
