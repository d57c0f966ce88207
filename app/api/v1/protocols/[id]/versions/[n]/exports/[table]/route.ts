import { NotFoundError } from "@/lib/errors";
import { csvResponse } from "@/lib/exports/respond";
import { exportFileName } from "@/lib/exports/planner-csv";
import { EXPORT_TABLES, versionCsv, type ExportTable } from "@/lib/exports/version-csv";
import { apiRoute } from "@/lib/http/api";
import { getVersionView } from "@/lib/protocols/queries";

export const runtime = "nodejs";

type Ctx = { params: Promise<{ id: string; n: string; table: string }> };

/** GET /api/v1/protocols/{id}/versions/{n}/exports/{sweep-map|windows|spectra} → text/csv of the saved version. */
export const GET = apiRoute("protocol.read", async (_req, caller, ctx: Ctx) => {
  const { id, n, table } = await ctx.params;
  const protocolId = Number(id);
  const number = Number(n);
  if (!Number.isInteger(protocolId) || !Number.isInteger(number)) throw new NotFoundError(`No version ${n} of protocol ${id}.`);
  if (!(EXPORT_TABLES as readonly string[]).includes(table)) throw new NotFoundError(`No table "${table}": choose one of ${EXPORT_TABLES.join(", ")}.`);
  const view = await getVersionView(caller.user, protocolId, number);
  return csvResponse(versionCsv(view.version.content, table as ExportTable), exportFileName(`${view.protocol.code}-v${view.version.number}`, table));
});
