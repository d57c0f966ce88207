import { SpectraChart, type SpectrumLine } from "@/components/charts/spectra-chart";
import { evaluateSpectra, waterPermittivity } from "@/lib/dielectric";
import { formatConductivity, formatFrequency } from "@/lib/units/format";
import type { ProtocolContent } from "@/lib/protocols/content";
import { spectraBody, toSeries } from "@/lib/wizard/spectra-request";

/**
 * Re[K] spectra of both populations in the version's medium (recomputed from the frozen content with the fixed seed),
 * with the chosen frequency marked. Read-only; a model failure is shown in words, not as an empty chart.
 */
export function VersionSpectra({ content }: { content: ProtocolContent }) {
  const s = content.selection;
  const medium = { conductivity: s.conductivity, permittivity: waterPermittivity(s.temperatureC) };
  let lines: SpectrumLine[];
  try {
    lines = (["target", "other"] as const).map((key, i) => {
      const pop = content.populations[key];
      return { key, label: pop.name, series: toSeries(evaluateSpectra(spectraBody(pop.spec, key, i, medium))) };
    });
  } catch (err) {
    return <p className="notice">The spectra could not be drawn from this content: {(err as Error).message}</p>;
  }
  return (
    <section className="card" data-testid="version-spectra">
      <h2 className="mb-1">Re[K] spectra at the chosen conductivity</h2>
      <p className="hint mb-3">
        {formatConductivity(s.conductivity)}, {s.temperatureC} °C; the marker is the drive frequency {formatFrequency(s.frequency)}. Bands: about the middle 80 % of sampled cells.
      </p>
      <SpectraChart lines={lines} marker={s.frequency} title={`Re[K] of ${lines[0].label} and ${lines[1].label} against frequency`} />
    </section>
  );
}
