import { buildOpenApiDocument } from "@/lib/api/openapi";

export const runtime = "nodejs";

/** GET /api/v1/openapi.json — the OpenAPI 3.1 document (public: it describes the API, it computes nothing). */
export function GET(): Response {
  return Response.json(buildOpenApiDocument(), { headers: { "cache-control": "public, max-age=300" } });
}
