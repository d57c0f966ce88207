/**
 * A recipe for a buffer given as a conductivity range: once a window is chosen, the buffer to make is the step's
 * sugar base brought to the window's conductivity (at 25 °C) with 1× PBS, solved by the engine's inverse recipe.
 */
import { additionForTargetConductivity, STOCKS } from "@/lib/dielectric";
import type { ProtocolContent } from "@/lib/protocols/content";

/**
 * The recipe per litre reaching `conductivity25` (S/m at 25 °C) from the sugar base, or null when PBS cannot reach it
 * (the base already conducts more, or the target is out of reach).
 * @example rangeRecipe(8.5, 0.3, 0.01)?.additions[0].perLitre // ≈ 6.5 (mL of 1× PBS per litre)
 */
export function rangeRecipe(sucrosePercentWV: number, glucosePercentWV: number, conductivity25: number): NonNullable<ProtocolContent["buffer"]["recipe"]> | null {
  try {
    const solved = additionForTargetConductivity({
      recipe: { volumeL: 1, temperatureC: 25, sucrosePercentWV, glucosePercentWV, additions: [] },
      kind: "PBS1x",
      targetConductivity: conductivity25,
    });
    const add = solved.addition as { volumeL: number };
    return {
      sucrosePercentWV,
      glucosePercentWV,
      additions: [{ label: STOCKS.PBS1x.label, kind: "stock", perLitre: add.volumeL * 1000 }],
      conductivity25: solved.result.conductivity25,
      osmolality: solved.result.osmolality * 1000,
    };
  } catch {
    return null;
  }
}
