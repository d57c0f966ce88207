import { describePath } from "@/lib/protocols/fields";
import type { ProtocolContent } from "@/lib/protocols/content";
import { formatPercent, formatQuantity } from "@/lib/units/format";

type Leaf = { path: string; text: string };

function isSpread(v: unknown): v is { mean: number; cv: number; distribution?: string } {
  return typeof v === "object" && v !== null && "mean" in v && "cv" in v;
}

function leaves(value: unknown, prefix: string): Leaf[] {
  if (isSpread(value)) {
    const { kind } = describePath(prefix);
    const spread = value.cv > 0 ? ` ± ${formatPercent(value.cv)} (${value.distribution ?? "normal"})` : "";
    return [{ path: prefix, text: `${formatQuantity(value.mean, kind)}${spread}` }];
  }
  if (typeof value === "object" && value !== null) {
    return Object.entries(value).flatMap(([k, v]) => leaves(v, prefix ? `${prefix}.${k}` : k));
  }
  const { kind } = describePath(prefix);
  return [{ path: prefix, text: typeof value === "number" ? formatQuantity(value, kind) : String(value) }];
}

/** The two populations side by side: every model parameter in lab units with its spread. */
export function PopulationTable({ populations }: { populations: ProtocolContent["populations"] }) {
  const target = new Map(leaves(populations.target.spec, "spec").map((l) => [l.path, l.text]));
  const other = new Map(leaves(populations.other.spec, "spec").map((l) => [l.path, l.text]));
  const paths = [...new Set([...target.keys(), ...other.keys()])];
  return (
    <table>
      <thead>
        <tr>
          <th className="w-2/5">Parameter</th>
          <th><span className="text-ember">Target</span> — {populations.target.name}</th>
          <th><span className="text-tide">Other</span> — {populations.other.name}</th>
        </tr>
      </thead>
      <tbody>
        {paths.map((p) => (
          <tr key={p}>
            <td className="text-ink-soft">{describePath(p.replace(/^spec\./, "x.")).label.replace(/^x · /, "")}</td>
            <td>{target.get(p) ?? "—"}</td>
            <td>{other.get(p) ?? "—"}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
