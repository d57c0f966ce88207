import { listAuditEvents } from "@/lib/audit/repo";
import { apiRoute } from "@/lib/http/api";
import { toCsv } from "@/lib/format/csv";
import { auditFilterFrom, auditQueryFrom } from "@/lib/protocols/audit-filter";

export const runtime = "nodejs";

/** The audit trail as CSV, with the same filters as the page (entity, entityId, actor, action, from, to); up to 10 000 rows. */
export const GET = apiRoute("audit.read", async (req) => {
  const events = await listAuditEvents(auditFilterFrom(auditQueryFrom(new URL(req.url).searchParams), 10_000));
  const rows = [
    ["id", "occurred_at_utc", "actor_email", "action", "entity_type", "entity_id", "summary", "before_json", "after_json"],
    ...events.map((e) => [
      e.id,
      e.occurredAt.toISOString(),
      e.actorEmail,
      e.action,
      e.entityType,
      e.entityId,
      e.summary,
      e.before === null ? "" : JSON.stringify(e.before),
      e.after === null ? "" : JSON.stringify(e.after),
    ]),
  ];
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(toCsv(rows), {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="sievewright-audit-${stamp}.csv"`,
      "cache-control": "no-store",
    },
  });
});
