import { apiRoute } from "@/lib/http/api";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { NotFoundError } from "@/lib/errors";
import { buildBenchSheet } from "@/lib/bench-sheet/layout";
import { renderBenchSheet } from "@/lib/bench-sheet/render";
import { benchSheetQuerySchema, sheetFileName } from "@/lib/bench-sheet/schemas";
import { loadSheetSourceByNumber } from "@/lib/bench-sheet/source";

export const runtime = "nodejs";

type Ctx = { params: Promise<{ id: string; n: string }> };

/**
 * GET /api/v1/protocols/{id}/versions/{n}/bench-sheet?paper=a4|letter&volumeMl=250 → application/pdf.
 * Technicians get approved versions only (404 otherwise); developers, reviewers and supervisors may print any version,
 * which is then marked NOT FOR BENCH USE unless approved and intact.
 */
export const GET = apiRoute("protocol.readApproved", async (req, caller, ctx: Ctx) => {
  const { id, n } = await ctx.params;
  const protocolId = Number(id);
  const number = Number(n);
  if (!Number.isInteger(protocolId) || !Number.isInteger(number)) throw new NotFoundError(`No version ${n} of protocol ${id}.`);
  const query = parseOrThrow(benchSheetQuerySchema, Object.fromEntries(new URL(req.url).searchParams));
  const source = await loadSheetSourceByNumber(caller.user, protocolId, number);
  const layout = buildBenchSheet(source, { volumeMl: query.volumeMl, paper: query.paper, printedAt: new Date(), printedBy: caller.user.name });
  const pdf = await renderBenchSheet(layout);
  return new Response(new Uint8Array(pdf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${sheetFileName(source.protocol.code, source.version.number, query.paper)}"`,
      "cache-control": "no-store",
    },
  });
});
