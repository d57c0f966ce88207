import { apiRoute } from "@/lib/http/api";
import { readJson } from "@/lib/http/body";
import { NotFoundError } from "@/lib/errors";
import { isLibraryKind } from "@/lib/library/kinds";
import { importLibrary } from "@/lib/library/transfer";

export const runtime = "nodejs";

/** Largest library file accepted: data files of fits can be up to 10 MiB each. */
const MAX_IMPORT_BYTES = 40 * 1024 * 1024;

/** Imports a library file (the export format); answers with what was imported and what was refused, and why. */
export const POST = apiRoute("library.edit", async (req, caller, ctx: { params: Promise<{ kind: string }> }) => {
  const { kind } = await ctx.params;
  if (!isLibraryKind(kind)) throw new NotFoundError(`There is no library called "${kind}".`);
  return importLibrary(caller.user, kind, await readJson(req, MAX_IMPORT_BYTES));
});
