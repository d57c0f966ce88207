import { apiRoute } from "@/lib/http/api";
import { NotFoundError } from "@/lib/errors";
import { isLibraryKind } from "@/lib/library/kinds";
import { exportLibrary } from "@/lib/library/transfer";

export const runtime = "nodejs";

/** Downloads a whole library kind (every item, version, fit and data file) as JSON in SI units. */
export const GET = apiRoute("library.read", async (_req, _caller, ctx: { params: Promise<{ kind: string }> }) => {
  const { kind } = await ctx.params;
  if (!isLibraryKind(kind)) throw new NotFoundError(`There is no library called "${kind}".`);
  const file = await exportLibrary(kind);
  const stamp = file.exportedAt!.slice(0, 10);
  return new Response(JSON.stringify(file, null, 2), {
    headers: { "content-type": "application/json; charset=utf-8", "content-disposition": `attachment; filename="sievewright-${kind}-${stamp}.json"` },
  });
});
