/**
 * The run-record upload of the public API, for the OpenAPI document. Its body is multipart (the record as JSON in the
 * field "run", files in "attachments"), so it is described here rather than among the JSON computation routes.
 */
import { MAX_ATTACHMENTS } from "@/lib/runs/attachments";
import { recordRunSchema } from "@/lib/runs/schemas";
import type { JsonSchema } from "./routes";

const errorRef = { "application/json": { schema: { $ref: "#/components/schemas/Error" } } };

/**
 * Component schemas the run route refers to, built from the run record's zod schema (`toJsonSchema` is the
 * document's own zod → JSON Schema step).
 * @example runSchemas(requestJsonSchema).RunRecord.properties.frequencyHz
 */
export function runSchemas(toJsonSchema: (s: typeof recordRunSchema) => JsonSchema): Record<string, JsonSchema> {
  return { RunRecord: toJsonSchema(recordRunSchema) };
}

/** OpenAPI path item of POST /api/v1/runs. */
export const RUN_PATHS: Record<string, Record<string, unknown>> = {
  "/api/v1/runs": {
    post: {
      operationId: "recordRun",
      summary: "Record a bench run against an approved, current protocol version (technicians)",
      description:
        "multipart/form-data: the field \"run\" holds the run record as JSON (schema RunRecord; lab units, the frequency in Hz as frequencyHz — frequencyKHz is deprecated but still accepted, give one of the two), " +
        `and up to ${MAX_ATTACHMENTS} files in "attachments" (PNG, JPEG, CSV or PDF, checked by content). ` +
        "The measured conductivity is compensated to 25 °C and checked against the version's acceptance range. Nothing is stored unless everything is valid.",
      requestBody: {
        required: true,
        content: {
          "multipart/form-data": {
            schema: {
              type: "object",
              required: ["run"],
              properties: {
                run: { type: "string", contentMediaType: "application/json", contentSchema: { $ref: "#/components/schemas/RunRecord" }, description: "The run record as JSON text." },
                attachments: { type: "array", items: { type: "string", format: "binary" } },
              },
            },
            encoding: { run: { contentType: "application/json" } },
          },
        },
      },
      responses: {
        "201": { description: "The stored run, SI units (S/m, Hz, V, osmol/kg; °C; minutes; recovery and purity as fractions).", content: { "application/json": { schema: { type: "object", properties: { run: { type: "object" } } } } } },
        "400": { description: "A field breaks a rule: each issue names the field (path), the value and the allowed range.", content: errorRef },
        "401": { description: "Not signed in and no valid token.", content: errorRef },
        "403": { description: "Only technicians record runs.", content: errorRef },
        "404": { description: "No such version, or not visible to you.", content: errorRef },
        "409": { description: "The version is not approved and current, or does not match what was signed.", content: errorRef },
        "413": { description: "The upload is larger than the attachment limit.", content: errorRef },
      },
    },
  },
};
