import { formatFlow, formatFrequency, formatMeterConductivity, formatMinutes, formatOsmolality, formatPercentFixed, formatTemperature, formatVpp } from "@/lib/units/format";
import { formatUtcMinute } from "@/lib/format/time";
import { formatFileSize } from "@/lib/units/size";
import type { BenchRun } from "@/lib/runs/repo";

/**
 * The runs of one version, newest first, with the conductivity flag in words (not colour alone), the measured
 * osmolality and minutes in the low-conductivity buffer (flagged past the sheet's `maxMinutesInBuffer`), and attachments.
 */
export function RunsTable({ runs, maxMinutesInBuffer }: { runs: BenchRun[]; maxMinutesInBuffer?: number }) {
  if (runs.length === 0) return <p className="text-sm text-ink-muted">No runs recorded against this version yet.</p>;
  return (
    <table data-testid="runs-table">
      <thead>
        <tr><th>When / who</th><th>Buffer</th><th>Conductivity</th><th>Settings</th><th>Observed</th><th>Notes and files</th></tr>
      </thead>
      <tbody>
        {runs.map((r) => (
          <tr key={r.id} data-testid={`run-${r.id}`}>
            <td>{formatUtcMinute(r.createdAt)}<span className="block text-xs text-ink-muted">{r.technicianName}</span></td>
            <td>
              {r.bufferLot}
              <span className="block text-xs text-ink-muted" data-testid="run-osmolality">{r.measuredOsmolality === null ? "osmolality not measured" : formatOsmolality(r.measuredOsmolality)}</span>
              {r.minutesInBuffer !== null && (
                <span className="block text-xs" data-testid="run-minutes">
                  {formatMinutes(r.minutesInBuffer)} in buffer
                  {maxMinutesInBuffer !== undefined && r.minutesInBuffer > maxMinutesInBuffer && <span className="pill border-danger/40 bg-danger-light text-danger">over the {formatMinutes(maxMinutesInBuffer)} limit</span>}
                </span>
              )}
            </td>
            <td>
              {formatMeterConductivity(r.measuredConductivity)} at {formatTemperature(r.measuredAtC)}
              <span className="block text-xs text-ink-muted">= {formatMeterConductivity(r.conductivity25)} at 25 °C</span>
              {r.conductivityAccepted ? (
                <span className="pill border-moss/40 bg-moss-light text-moss-dark">within range</span>
              ) : (
                <span className="pill border-danger/40 bg-danger-light text-danger" data-testid="out-of-range">
                  OUT OF RANGE: accepted {formatMeterConductivity(r.targetConductivity25 * (1 - r.tolerance))} to {formatMeterConductivity(r.targetConductivity25 * (1 + r.tolerance))}
                </span>
              )}
            </td>
            <td>{formatFrequency(r.frequencyHz, 4)}, {formatVpp(r.voltageVpp)}<span className="block text-xs text-ink-muted">{formatTemperature(r.operatingTemperatureC)}{r.flowRateUlPerMin === null ? "" : `, ${formatFlow(r.flowRateUlPerMin)}`}</span></td>
            <td>
              {r.observedRecovery === null ? "—" : `recovery ${formatPercentFixed(r.observedRecovery)}`}
              <span className="block">{r.observedPurity === null ? "" : `purity ${formatPercentFixed(r.observedPurity)}`}</span>
              {r.countingMethod && <span className="block text-xs text-ink-muted">{r.countingMethod}</span>}
            </td>
            <td className="max-w-xs">
              {r.deviations && <p><span className="font-medium">Deviations:</span> {r.deviations}</p>}
              {r.notes && <p>{r.notes}</p>}
              {r.attachments.map((a) => (
                <a key={a.id} className="block text-sm" href={`/api/v1/runs/attachments/${a.id}`}>{a.fileName} ({a.mimeType}, {formatFileSize(a.sizeBytes)})</a>
              ))}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
