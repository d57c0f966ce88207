import type { ProtocolContent } from "@/lib/protocols/content";
import { describePath } from "@/lib/protocols/fields";
import { formatCellDensity, formatConductivity, formatPercent, formatQuantity, formatVpp } from "@/lib/units/format";
import { sig } from "@/lib/units/number";
import { PopulationTable } from "./population-table";

function Rows({ rows }: { rows: [string, React.ReactNode][] }) {
  return (
    <dl className="grid grid-cols-[minmax(7rem,45%)_1fr] gap-x-4 gap-y-1.5 text-sm">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ink-soft">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
    </dl>
  );
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** Every input of a version, read-only, in lab units. */
export function InputsView({ content }: { content: ProtocolContent }) {
  const { buffer, device, cellPrep } = content;
  const recipe = buffer.recipe;
  return (
    <div className="space-y-5">
      <section className="card">
        <h2 className="mb-3">Populations</h2>
        <PopulationTable populations={content.populations} />
      </section>
      <section className="card">
          <h2 className="mb-3">Buffer{buffer.name ? ` — ${buffer.name}` : ""}</h2>
          <Rows
            rows={[
              ["Target conductivity (25 °C)", formatConductivity(buffer.targetConductivity25)],
              ["Accepted tolerance", `± ${formatPercent(buffer.tolerance)}`],
              ["Osmolality", buffer.osmolality === null ? "not stated" : formatQuantity(buffer.osmolality, "osmolalityMilli")],
              ["Longest time in buffer", `${buffer.maxMinutesInBuffer} min`],
              ...(recipe
                ? ([
                    ["Sucrose / glucose", `${sig(recipe.sucrosePercentWV)} % / ${sig(recipe.glucosePercentWV)} % w/v`],
                    ...recipe.additions.map((a, i): [string, string] => [`Addition ${i + 1}`, `${a.label}: ${sig(a.perLitre)} ${a.kind === "solid" ? "g" : "mL"} per litre`]),
                    ["Recipe prediction", `${formatConductivity(recipe.conductivity25)} at 25 °C, ${formatQuantity(recipe.osmolality, "osmolalityMilli")}`],
                  ] as [string, string][])
                : ([["Recipe", "measured buffer, no recipe"]] as [string, string][])),
            ]}
          />
        </section>
        <section className="card">
          <h2 className="mb-3">Device and drive{device.name ? ` — ${device.name}` : ""}</h2>
          <Rows
            rows={[
              ["Geometry", device.geometry],
              ...Object.entries(device.dimensions).map(([k, v]): [string, string] => [capital(describePath(k).label), formatQuantity(v, describePath(k).kind)]),
              ["Gradient factor Γ", `${formatQuantity(device.gradientFactor, "gradient")} (${device.gradientSource})`],
              ["Generator limit", formatVpp(device.maxVoltageVpp)],
              ["Sort design", content.sortDesign],
              ["Target fraction in the input", formatPercent(content.inputMix.targetFraction)],
            ]}
          />
        </section>
      <div className="grid gap-5 lg:grid-cols-2">
        <section className="card">
          <h2 className="mb-3">Cell preparation</h2>
          <Rows
            rows={[
              ["Washes", String(cellPrep.washes)],
              ["Resuspension density", formatCellDensity(cellPrep.resuspensionCellsPerMl)],
              ["Notes", cellPrep.notes ? <span className="whitespace-pre-wrap">{cellPrep.notes}</span> : "none"],
            ]}
          />
        </section>
        <section className="card">
          <h2 className="mb-3">Limits</h2>
          <Rows rows={Object.entries(content.limits).map(([k, v]): [string, string] => [capital(describePath(k).label), formatQuantity(v, describePath(k).kind)])} />
          <p className="hint mt-3">Engine {content.plan.engineVersion}, sampling seed {content.plan.seed}.</p>
        </section>
      </div>
    </div>
  );
}
