/**
 * Bench-sheet wording for the flow and the heating of a saved plan. Every sort design moves cells with a flow, so the
 * sheet never calls a plan "static"; a capture plan also states the local flow its trapped cells must withstand.
 */
import type { WindowsResult } from "@/lib/planner";
import { formatFlow, formatLength, formatTemperatureRise, formatVelocity } from "@/lib/units/format";

type SavedResult = Partial<Pick<WindowsResult, "model" | "windows">> | null | undefined;

/**
 * The flow-rate line of the sheet.
 * @example flowText(5, result) // → "5 µL/min; trapped cells must withstand the local flow of ≈ 800 µm/s at 10 µm above the electrodes"
 * @example flowText(null, result) // → "not set in this plan (the drive was sized for a DEP speed) …"
 */
export function flowText(flowRateUlPerMin: number | null, result: unknown): string {
  const holding = (result as SavedResult)?.model?.holding ?? null;
  if (flowRateUlPerMin === null) {
    return "not set in this plan (the drive was sized for a DEP speed, not a flow rate); this sort design moves cells with a flow, so set a steady flow by your device's procedure before switching on the field";
  }
  const base = formatFlow(flowRateUlPerMin);
  if (!holding) return base;
  return `${base}; trapped cells must withstand the local flow of ≈ ${formatVelocity(holding.localFlowSpeed)} at ${formatLength(holding.height)} above the electrodes (parabolic profile, model)`;
}

/**
 * The predicted-heating line: the estimate checked against the limit and, for an electrode array, the isolated-pair one.
 * @example heatingText(2.1, 1, result) // → "+2.1 K over the electrode array (array estimate; isolated pair +0.2 K) — order-of-magnitude model estimates"
 */
export function heatingText(deltaT: number, rank: number, result: unknown): string {
  const w = (result as SavedResult)?.windows?.find((x) => x.rank === rank);
  const h = w?.heating;
  const k = (x: number) => `+${formatTemperatureRise(x, 2)}`;
  if (!h || h.array === null) return `${k(deltaT)} at the electrodes (Joule, isolated-pair model estimate)`;
  return `${k(h.array)} over the electrode array (array estimate; isolated pair ${k(h.isolatedPair)}) — order-of-magnitude model estimates`;
}
