"use client";

import { useEffect, useState } from "react";

/**
 * The value, updated only after it has stopped changing for `delayMs` (compared by JSON, so new objects with the
 * same content do not restart the timer).
 * @example const debouncedSpecs = useDebounced(specs, 400);
 */
export function useDebounced<T>(value: T, delayMs = 400): T {
  const json = JSON.stringify(value);
  const [state, setState] = useState<{ json: string; value: T }>({ json, value });
  useEffect(() => {
    if (json === state.json) return;
    const t = setTimeout(() => setState({ json, value: JSON.parse(json) as T }), delayMs);
    return () => clearTimeout(t);
  }, [json, delayMs, state.json]);
  return state.value;
}

/**
 * True once `active` has stayed true for `afterMs` — shows a progress state only for waits a person notices.
 * @example const showSpinner = useSlow(query.isFetching, 200);
 */
export function useSlow(active: boolean, afterMs = 200): boolean {
  const [slowSince, setSlowSince] = useState<boolean>(false);
  useEffect(() => {
    if (!active) return;
    const t = setTimeout(() => setSlowSince(true), afterMs);
    return () => {
      clearTimeout(t);
      setSlowSince(false);
    };
  }, [active, afterMs]);
  return active && slowSince;
}
