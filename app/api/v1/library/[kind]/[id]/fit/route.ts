import { apiRoute } from "@/lib/http/api";
import { readJson } from "@/lib/http/body";
import { NotFoundError } from "@/lib/errors";
import { saveFittedPopulation } from "@/lib/library/fit-service";

export const runtime = "nodejs";

/** Room for a 10 MiB crossover file inside its JSON envelope. */
const MAX_FIT_BYTES = 24 * 1024 * 1024;

/** Re-fits the uploaded crossover CSV on the server and saves it as a new, "fitted" version of the population. */
export const POST = apiRoute("library.edit", async (req, caller, ctx: { params: Promise<{ kind: string; id: string }> }) => {
  const { kind, id } = await ctx.params;
  if (kind !== "populations" || !/^\d+$/.test(id)) throw new NotFoundError("Only populations can be fitted from crossovers.");
  const item = await saveFittedPopulation(caller.user, Number(id), await readJson(req, MAX_FIT_BYTES));
  return { id: item.id, version: item.currentVersion, provenance: item.current.provenance };
});
