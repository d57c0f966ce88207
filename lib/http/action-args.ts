import { z } from "zod";
import { parseOrThrow } from "./zod-issues";

/**
 * Plain arguments of server actions (ids, flags, short texts). A client can call an action with anything, so each
 * argument is checked by name and a wrong type comes back as that field's message, not as a generic server error.
 */

function shown(value: unknown): string {
  if (typeof value === "string") return `"${value.length > 40 ? `${value.slice(0, 40)}…` : value}"`;
  if (value === null || typeof value !== "object") return String(value);
  return Array.isArray(value) ? "a list" : "an object";
}

/**
 * A record id: a whole number from 1.
 * @example actionArgs({ protocolId: recordId("protocol id") }, { protocolId: "abc" }) // InputError: protocol id must be a record id …
 */
export function recordId(what: string) {
  const rule = (input: unknown) => `${what} must be a record id (a whole number from 1); got ${shown(input)}`;
  return z.number({ error: (iss) => rule(iss.input) }).int({ error: (iss) => rule(iss.input) }).positive({ error: (iss) => rule(iss.input) });
}

/**
 * A yes/no flag.
 * @example actionArgs({ archived: flag("archived") }, { archived: "yes" }) // InputError: archived must be true or false …
 */
export function flag(what: string) {
  return z.boolean({ error: (iss) => `${what} must be true or false; got ${shown(iss.input)}` });
}

/**
 * A short text of at most `max` characters.
 * @example actionArgs({ title: shortText("title", 200).optional() }, { title: 7 }) // InputError: title must be a text …
 */
export function shortText(what: string, max: number) {
  return z.string({ error: (iss) => `${what} must be a text of at most ${max} characters; got ${shown(iss.input)}` }).max(max, { error: `${what} must be at most ${max} characters long` });
}

/**
 * Checks an action's arguments by name; throws an InputError whose issues are keyed by those names.
 * @example const { protocolId } = actionArgs({ protocolId: recordId("protocol id") }, { protocolId });
 */
export function actionArgs<S extends z.ZodRawShape>(shape: S, values: { [K in keyof S]: unknown }): z.output<z.ZodObject<S>> {
  return parseOrThrow(z.object(shape), values);
}
