"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requireActionUser } from "@/lib/auth/session";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { saveCharacterisedPopulation } from "./service";

const idSchema = z.number({ error: "Population: missing id." }).int().positive();

/**
 * Re-fits the uploaded cells on the server and saves the population's spreads as a new version.
 * @example await saveCharacterisationAction(3, { baseVersion: 2, fileName, csvText, medium, device, fit, exclude: [] })
 */
export async function saveCharacterisationAction(id: number, input: unknown): Promise<ActionResult<{ id: number; version: number }>> {
  return runAction(async () => {
    const actor = await requireActionUser("library.edit");
    const { item, fit } = await saveCharacterisedPopulation(actor, parseOrThrow(idSchema, id), input);
    revalidatePath(`/library/populations/${item.id}`);
    return { ok: true, message: `Saved version ${item.currentVersion} of "${item.name}" with the spreads of ${fit.includedCount} cells.`, data: { id: item.id, version: item.currentVersion } };
  });
}
