import type { z } from "zod";
import { InputError, type FieldIssue } from "@/lib/errors";

/**
 * Turns a zod error into field issues with dotted paths ("particles.0.radius").
 * @example zodIssues(schema.safeParse(body).error!) // [{ path: "radius", message: "…" }]
 */
export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join("."), message: i.message }));
}

/**
 * Parses `input` with `schema`, or throws an InputError naming every bad field.
 * @example const body = parseOrThrow(createUserSchema, await req.json());
 */
export function parseOrThrow<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input);
  if (!result.success) throw new InputError(zodIssues(result.error));
  return result.data;
}
