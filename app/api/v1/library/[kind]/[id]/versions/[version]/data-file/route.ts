import { apiRoute } from "@/lib/http/api";
import { NotFoundError } from "@/lib/errors";
import { isLibraryKind } from "@/lib/library/kinds";
import { getDataFile } from "@/lib/library/service";

export const runtime = "nodejs";

/** Downloads the data file a version's values were fitted from, exactly as uploaded. */
export const GET = apiRoute("library.read", async (_req, _caller, ctx: { params: Promise<{ kind: string; id: string; version: string }> }) => {
  const { kind, id, version } = await ctx.params;
  if (!isLibraryKind(kind) || !/^\d+$/.test(id) || !/^\d+$/.test(version)) throw new NotFoundError("No such data file.");
  const file = await getDataFile(kind, Number(id), Number(version));
  const safe = file.name.replace(/[^\w.\- ]+/g, "_");
  return new Response(file.text, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${safe}"` } });
});
