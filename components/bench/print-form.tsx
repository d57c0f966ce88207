import { DEFAULT_VOLUME_ML, VOLUME_LIMITS_ML } from "@/lib/bench-sheet/recipe";
import { PAPER_SIZES } from "@/templates/bench-sheet/layout";

/**
 * Download form for the bench sheet: buffer volume (mL) and paper size, sent as a plain GET to the PDF route so the
 * browser saves the file.
 */
export function PrintForm({ protocolId, number, benchReady }: { protocolId: number; number: number; benchReady: boolean }) {
  return (
    <form method="get" action={`/api/v1/protocols/${protocolId}/versions/${number}/bench-sheet`} className="flex flex-wrap items-end gap-4" data-testid="print-form">
      <label className="field w-44">
        <span>Buffer volume to make</span>
        <span className="flex items-center gap-2 font-normal">
          <input className="input" type="number" name="volumeMl" min={VOLUME_LIMITS_ML.min} max={VOLUME_LIMITS_ML.max} step="any" defaultValue={DEFAULT_VOLUME_ML} required aria-label="Buffer volume in mL" />
          mL
        </span>
        <span className="hint font-normal">{VOLUME_LIMITS_ML.min} to {VOLUME_LIMITS_ML.max} mL; the recipe is scaled to it.</span>
      </label>
      <label className="field w-40">
        <span>Paper</span>
        <select className="input" name="paper" defaultValue="a4">
          {Object.entries(PAPER_SIZES).map(([id, p]) => <option key={id} value={id}>{p.label}</option>)}
        </select>
      </label>
      <button type="submit" className="btn">Download bench sheet (PDF)</button>
      {!benchReady && <p className="w-full text-sm text-danger">This version is not approved for bench use: the sheet prints marked NOT FOR BENCH USE.</p>}
    </form>
  );
}
