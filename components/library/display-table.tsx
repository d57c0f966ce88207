import type { DisplayRow } from "@/lib/library/populations/content";

/** Label/value rows of an item version, in lab units. */
export function DisplayTable({ rows, testId }: { rows: DisplayRow[]; testId?: string }) {
  return (
    <table data-testid={testId}>
      <tbody>
        {rows.map((r) => (
          <tr key={r.key}>
            <th scope="row" className="w-64 border-b border-paper-line/70 font-normal text-ink-soft">{r.label}</th>
            <td className="whitespace-pre-line">{r.value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
