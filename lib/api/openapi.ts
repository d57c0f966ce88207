/**
 * The OpenAPI 3.1 document of the public JSON API. Request schemas are generated from the engine's zod schemas with
 * zod's `z.toJSONSchema`, so the document cannot drift from what the routes accept.
 */
import { CSV_PATHS } from "./csv-routes";
import { RUN_PATHS, runSchemas } from "./run-routes";
import { z } from "zod";
import { ENGINE_VERSION } from "@/lib/dielectric";
import { MAX_JSON_BYTES } from "@/lib/http/body";
import { ENGINE_VERSION_HEADER } from "./respond";
import { ROUTE_DOCS, type JsonSchema, type RouteDoc } from "./routes";

/** Error codes the API answers with, and the HTTP status of each. */
export const ERROR_RESPONSES = {
  "400": { code: "invalid_input", description: "The body is not valid JSON, or a field breaks a rule. The issues list names each field (path) and what is wrong (message), including grids over the cap." },
  "401": { code: "unauthenticated", description: "No session and no token, a malformed Authorization header, or a token that is unknown or revoked." },
  "403": { code: "forbidden", description: "Signed in, but the role may not use the computation API (technicians and admins)." },
  "413": { code: "too_large", description: `The body is larger than ${MAX_JSON_BYTES / 1048576} MiB (${MAX_JSON_BYTES} bytes).` },
  "503": { code: "service_unavailable", description: "The database cannot be reached at the moment; nothing was read or saved. Retry after the number of seconds in the Retry-After header." },
  "429": { code: "rate_limited", description: "Too many requests for this token in the current minute; wait for the number of seconds in the Retry-After header." },
} as const;

/**
 * JSON Schema (draft 2020-12) of a zod schema's accepted input, without the `$schema` key OpenAPI does not want.
 * @example requestJsonSchema(sweepRequestSchema).properties.frequencies
 */
export function requestJsonSchema(schema: z.ZodType): JsonSchema {
  const out = z.toJSONSchema(schema, { target: "draft-2020-12", io: "input", unrepresentable: "any" }) as JsonSchema;
  delete out.$schema;
  return out;
}

const ERROR_SCHEMA: JsonSchema = {
  type: "object",
  required: ["error", "message"],
  properties: {
    error: { type: "string", enum: [...Object.values(ERROR_RESPONSES).map((e) => e.code), "internal"] },
    message: { type: "string", description: "What went wrong, in words." },
    issues: {
      type: "array",
      description: "Only with invalid_input: one entry per bad field.",
      items: {
        type: "object",
        required: ["path", "message"],
        properties: {
          path: { type: "string", description: "Where the problem is, e.g. particles[0].shells[1].thickness; empty for the whole body." },
          message: { type: "string", description: "The field, the bad value and the allowed range." },
        },
      },
    },
  },
};

function errorResponses(): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [status, e] of Object.entries(ERROR_RESPONSES)) {
    out[status] = {
      description: e.description,
      ...(status === "429" || status === "503" ? { headers: { "Retry-After": { description: status === "429" ? "Seconds until the next minute window." : "Seconds to wait before trying again.", schema: { type: "integer" } } } } : {}),
      content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } },
    };
  }
  return out;
}

function operation(route: RouteDoc): Record<string, unknown> {
  return {
    operationId: route.operationId,
    summary: route.summary,
    description: [...route.description, ...(route.binary ? [route.binary.description] : [])].join("\n\n"),
    requestBody: {
      required: true,
      content: {
        "application/json": {
          schema: { $ref: `#/components/schemas/${route.requestName}` },
          examples: { [route.operationId]: { summary: route.example.summary, description: route.example.description, value: route.example.body } },
        },
      },
    },
    responses: {
      "200": {
        description: "The result, SI units.",
        headers: {
          [ENGINE_VERSION_HEADER]: { description: "Version of the dielectric engine that computed the result.", schema: { type: "string" } },
          "Server-Timing": { description: "Milliseconds the server spent: read (body), compute (validation and engine), serialize (JSON), app (the whole request, authentication included).", schema: { type: "string" } },
        },
        content: {
          "application/json": { schema: { $ref: `#/components/schemas/${route.responseName}` } },
          ...(route.binary ? { [route.binary.mediaType]: { schema: { type: "string", contentMediaType: route.binary.mediaType, description: route.binary.description } } } : {}),
        },
      },
      ...errorResponses(),
    },
  };
}

/**
 * Builds the whole OpenAPI 3.1 document.
 * @example buildOpenApiDocument().paths["/api/v1/sweeps"].post.operationId // → "evaluateSweep"
 */
export function buildOpenApiDocument(routes: RouteDoc[] = ROUTE_DOCS) {
  const schemas: Record<string, JsonSchema> = { Error: ERROR_SCHEMA };
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of routes) {
    schemas[r.requestName] = requestJsonSchema(r.requestSchema);
    schemas[r.responseName] = r.responseSchema;
    paths[r.path] = { [r.method]: operation(r) };
  }
  Object.assign(paths, CSV_PATHS, RUN_PATHS);
  Object.assign(schemas, runSchemas(requestJsonSchema));
  return {
    openapi: "3.1.0",
    info: {
      title: "Sievewright computation API",
      version: "1",
      description: `Dielectrophoresis computations for scripts and notebooks: Clausius–Mossotti spectra, sweep maps and operating windows. SI units in every request and response. Engine version ${ENGINE_VERSION}. Authenticate with a personal API token (create one on the Settings page; it is shown once) sent as "Authorization: Bearer <token>", or with a signed-in browser session. Requests are limited per token per minute (429 with Retry-After beyond it).`,
    },
    servers: [{ url: "/", description: "This Sievewright server" }],
    security: [{ bearerToken: [] }, { session: [] }],
    paths,
    components: {
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", description: "Personal API token from the Settings page (starts with sw_)." },
        session: { type: "apiKey", in: "cookie", name: "next-auth.session-token", description: "The browser session of a signed-in user (used by the API page)." },
      },
      schemas,
    },
  };
}
