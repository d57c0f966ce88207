import { formatConductivity, formatFrequency, formatTemperature } from "@/lib/units/format";
import { SPECTRUM_GRID } from "@/lib/wizard/spectra-request";
import type { ProtocolContent } from "@/lib/protocols/content";
import { timedSync } from "@/lib/http/page-timing";
import { versionSpectra } from "@/lib/protocols/version-spectra";
import { VersionSpectraChart } from "./version-spectra-chart";
import { exportFileName } from "@/lib/exports/planner-csv";

/**
 * Re[K] spectra of both populations in the version's medium (recomputed from the frozen content with the fixed seed,
 * once per content hash), with the chosen frequency marked. The crossovers are stated in words on the server; the
 * chart itself is drawn in the browser, with SVG and PNG downloads named after `fileLabel` (e.g. "PRT-0001 v2").
 * Read-only; a model failure is shown in words, not as an empty chart.
 */
export function VersionSpectra({ content, contentHash, fileLabel }: { content: ProtocolContent; contentHash: string; fileLabel: string }) {
  const s = content.selection;
  const spectra = timedSync("spectra", () => versionSpectra(content, contentHash));
  if (!spectra.ok) return <p className="notice">The spectra could not be drawn from this content: {spectra.message}</p>;
  const { lines } = spectra;
  return (
    <section className="card" data-testid="version-spectra">
      <h2 className="mb-1">Re[K] spectra at the chosen conductivity</h2>
      <p className="hint mb-3">
        {formatConductivity(s.conductivity)}, {formatTemperature(s.temperatureC)}; the marker is the drive frequency {formatFrequency(s.frequency)}. Bands: about the middle 80 % of sampled cells.
      </p>
      <VersionSpectraChart lines={lines} marker={s.frequency} title={`Re[K] of ${lines[0].label} and ${lines[1].label} against frequency`} fileName={exportFileName(fileLabel, "spectra", "").replace(/\.$/, "")} />
      <ul className="mt-2 text-sm text-ink-soft" data-testid="version-crossovers">
        {lines.map((l) => (
          <li key={l.key}>
            {l.label}: {l.series.crossovers.length === 0 ? `no crossover between ${formatFrequency(SPECTRUM_GRID.start)} and ${formatFrequency(SPECTRUM_GRID.stop)}` : `crossover${l.series.crossovers.length === 1 ? "" : "s"} at ${l.series.crossovers.map((x) => formatFrequency(x)).join(", ")}`}
          </li>
        ))}
      </ul>
    </section>
  );
}
