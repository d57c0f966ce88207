import { apiRoute } from "@/lib/http/api";
import { ServerTiming } from "@/lib/http/timing";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { NotFoundError } from "@/lib/errors";
import { benchSheetQuerySchema, sheetFileName } from "@/lib/bench-sheet/schemas";
import { loadSheetSourceByNumber } from "@/lib/bench-sheet/source";
import { benchSheetFile } from "@/lib/bench-sheet/stored";

export const runtime = "nodejs";

type Ctx = { params: Promise<{ id: string; n: string }> };

/** The SHA-256 a client already holds, from If-None-Match: "<sha256>" (weak or strong, first of a list). */
function knownTag(req: Request): string | null {
  const m = /"([0-9a-f]{64})"/.exec(req.headers.get("if-none-match") ?? "");
  return m ? m[1] : null;
}

/**
 * GET /api/v1/protocols/{id}/versions/{n}/bench-sheet?paper=a4|letter&volumeMl=250 → application/pdf.
 * Technicians get approved versions only (404 otherwise); developers, reviewers and supervisors may print any version,
 * which is then marked NOT FOR BENCH USE unless approved and intact. An approved version's sheet is stored once and
 * served with ETag "<sha256>" (If-None-Match → 304); other versions are drawn on demand and not cached.
 */
export const GET = apiRoute("protocol.readApproved", async (req, caller, ctx: Ctx) => {
  const timing = new ServerTiming();
  const { id, n } = await ctx.params;
  const protocolId = Number(id);
  const number = Number(n);
  if (!Number.isInteger(protocolId) || !Number.isInteger(number)) throw new NotFoundError(`No version ${n} of protocol ${id}.`);
  const query = parseOrThrow(benchSheetQuerySchema, Object.fromEntries(new URL(req.url).searchParams));
  const source = await timing.step("db", () => loadSheetSourceByNumber(caller.user, protocolId, number));
  const known = knownTag(req);
  const file = await timing.step("sheet", () => benchSheetFile(source, { paper: query.paper, volumeMl: query.volumeMl, printedBy: caller.user.name, knownSha256: known }));
  const headers: Record<string, string> = file.sha256
    ? { etag: `"${file.sha256}"`, "cache-control": "private, no-cache", "server-timing": timing.header() }
    : { "cache-control": "no-store", "server-timing": timing.header() };
  if (file.sha256 && !file.bytes) return new Response(null, { status: 304, headers });
  return new Response(file.bytes as Uint8Array<ArrayBuffer>, {
    headers: {
      ...headers,
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${sheetFileName(source.protocol.code, source.version.number, query.paper)}"`,
      "x-content-type-options": "nosniff",
    },
  });
});
