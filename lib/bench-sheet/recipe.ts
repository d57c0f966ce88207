import type { z } from "zod";
import type { bufferRecipeSchema } from "@/lib/protocols/content";
import { InputError } from "@/lib/errors";

/** A buffer recipe per litre as frozen in a protocol version. */
export type RecipePerLitre = z.infer<typeof bufferRecipeSchema>;

/** Smallest and largest buffer volume a technician may ask the sheet for, mL. */
export const VOLUME_LIMITS_ML = { min: 1, max: 5000 } as const;

/** Volume printed when the technician does not choose one, mL. */
export const DEFAULT_VOLUME_ML = 100;

/** One line of a scaled recipe: grams of a solid or millilitres of a stock. */
export interface ScaledItem {
  label: string;
  kind: "solid" | "stock";
  amount: number;
  unit: "g" | "mL";
}

/** A recipe scaled to the volume the technician makes. */
export interface ScaledRecipe {
  finalVolumeMl: number;
  sucroseG: number;
  glucoseG: number;
  items: ScaledItem[];
}

/**
 * Checks a buffer volume in mL; throws an InputError naming the allowed range.
 * @example checkVolumeMl(250) // 250
 */
export function checkVolumeMl(volumeMl: number): number {
  if (!Number.isFinite(volumeMl) || volumeMl < VOLUME_LIMITS_ML.min || volumeMl > VOLUME_LIMITS_ML.max) {
    throw new InputError([
      { path: "volumeMl", message: `Buffer volume: ${String(volumeMl)} mL is outside ${VOLUME_LIMITS_ML.min}–${VOLUME_LIMITS_ML.max} mL.` },
    ]);
  }
  return volumeMl;
}

/**
 * Scales a per-litre recipe to `volumeMl`: sugars from % w/v (g per 100 mL), solids in g/L and stocks in mL/L.
 * @example scaleRecipe({ sucrosePercentWV: 8.5, glucosePercentWV: 0.3, additions: [], conductivity25: 0.01, osmolality: 290 }, 250).sucroseG // 21.25 g
 */
export function scaleRecipe(recipe: RecipePerLitre, volumeMl: number): ScaledRecipe {
  checkVolumeMl(volumeMl);
  const litres = volumeMl / 1000;
  return {
    finalVolumeMl: volumeMl,
    sucroseG: (recipe.sucrosePercentWV * volumeMl) / 100,
    glucoseG: (recipe.glucosePercentWV * volumeMl) / 100,
    items: recipe.additions.map((a) => ({
      label: a.label,
      kind: a.kind,
      amount: a.perLitre * litres,
      unit: a.kind === "solid" ? "g" : "mL",
    })),
  };
}
