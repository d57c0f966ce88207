import { forbidden, notFound } from "next/navigation";
import { ForbiddenError, NotFoundError } from "@/lib/errors";

/**
 * For pages: awaits a read and turns NotFoundError into the 404 page and ForbiddenError into the 403 page.
 * @example const view = await orPageError(getVersionView(user, id, n));
 */
export async function orPageError<T>(read: Promise<T>): Promise<T> {
  try {
    return await read;
  } catch (err) {
    if (err instanceof NotFoundError) notFound();
    if (err instanceof ForbiddenError) forbidden();
    throw err;
  }
}

/**
 * A positive whole number from a route segment, or the 404 page.
 * @example const id = routeNumber(params.id);
 */
export function routeNumber(segment: string): number {
  const n = Number(segment);
  if (!Number.isInteger(n) || n <= 0) notFound();
  return n;
}
