"use client";

import { useSyncExternalStore } from "react";

const subscribe = () => () => {};

/**
 * False during server rendering and hydration, true once React runs in the browser. Submit buttons of forms handled
 * in JavaScript stay disabled until then, so an early click cannot fall back to a native submission (which would put
 * field values, passwords included, into the URL) or be silently lost.
 * @example const hydrated = useHydrated(); <button disabled={!hydrated || isSubmitting}>Save</button>
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(subscribe, () => true, () => false);
}
