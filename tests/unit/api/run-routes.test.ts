import { describe, expect, it } from "vitest";
import { buildOpenApiDocument } from "@/lib/api/openapi";

describe("OpenAPI document: POST /api/v1/runs", () => {
  it("documents the run record with frequencyHz (SI), the deprecated frequencyKHz, osmolality and minutes in buffer with their ranges", () => {
    const doc = buildOpenApiDocument();
    const op = doc.paths["/api/v1/runs"].post as { operationId: string; requestBody: { content: Record<string, unknown> } };
    expect(op.operationId).toBe("recordRun");
    expect(Object.keys(op.requestBody.content)).toEqual(["multipart/form-data"]);
    const record = doc.components.schemas.RunRecord as { properties: Record<string, { minimum?: number; maximum?: number; deprecated?: boolean; description?: string }>; required: string[] };
    expect(record.properties.frequencyHz).toMatchObject({ minimum: 100, maximum: 5e8 });
    expect(record.properties.frequencyKHz.deprecated).toBe(true);
    expect(record.properties.osmolalityMOsmPerKg).toMatchObject({ minimum: 10, maximum: 2000 });
    expect(record.properties.minutesInBuffer).toMatchObject({ minimum: 0, maximum: 1440 });
    expect(record.required).not.toContain("frequencyHz"); // one of frequencyHz / frequencyKHz, checked by the route
    expect(record.required).toContain("conductivityUsPerCm");
  });
});
