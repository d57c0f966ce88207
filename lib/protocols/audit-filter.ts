import type { AuditFilter } from "@/lib/audit/repo";

/** Query parameters of the audit-trail page and its CSV export. */
export interface AuditQuery {
  entity?: string;
  entityId?: string;
  actor?: string;
  action?: string;
  from?: string;
  to?: string;
}

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/**
 * Turns the page's query (dates as YYYY-MM-DD, UTC; "to" includes the whole day) into a repository filter.
 * @example auditFilterFrom({ entity: "protocol_version", from: "2026-12-01" }).from // 2026-12-01T00:00:00.000Z
 */
export function auditFilterFrom(q: AuditQuery, limit = 500): AuditFilter {
  const text = (s?: string) => (s && s.trim() ? s.trim().slice(0, 120) : undefined);
  return {
    entityType: text(q.entity),
    entityId: text(q.entityId),
    actorEmail: text(q.actor),
    action: text(q.action),
    from: q.from && DAY.test(q.from) ? new Date(`${q.from}T00:00:00.000Z`) : undefined,
    to: q.to && DAY.test(q.to) ? new Date(`${q.to}T23:59:59.999Z`) : undefined,
    limit,
  };
}

/**
 * The query from URL search parameters.
 * @example auditQueryFrom(new URL(req.url).searchParams)
 */
export function auditQueryFrom(params: URLSearchParams): AuditQuery {
  const get = (k: string) => params.get(k) ?? undefined;
  return { entity: get("entity"), entityId: get("entityId"), actor: get("actor"), action: get("action"), from: get("from"), to: get("to") };
}
