"use client";

import { useEffect, useRef, useState } from "react";
import { saveStepAction } from "@/lib/wizard/drafts/actions";
import type { StepSlug } from "@/lib/wizard/steps";

/** Autosave state shown next to the step's buttons ("pending": changed since the last save, saving shortly). */
export type SaveState =
  | { kind: "idle" }
  | { kind: "pending" }
  | { kind: "saving" }
  | { kind: "saved"; at: string }
  | { kind: "error"; message: string };

/**
 * Saves a step's values to the server draft 800 ms after the last change (as typed, valid or not), so a reload,
 * a lost tab or a sign-out loses nothing. While a change waits for its save the state is "pending", never "saved",
 * so the status never claims a save that has not happened. Returns the state and `saveNow` for the Next button.
 * @example const { state, saveNow } = useAutosave(draftId, "buffer", watch());
 */
export function useAutosave(draftId: number, step: StepSlug, values: unknown, delayMs = 800) {
  const [state, setState] = useState<SaveState>({ kind: "idle" });
  const serialized = JSON.stringify(values);
  const last = useRef(serialized);
  const [savedSerialized, setSavedSerialized] = useState(serialized);

  useEffect(() => {
    if (serialized === last.current) return;
    const timer = setTimeout(async () => {
      setState({ kind: "saving" });
      const result = await saveStepAction(draftId, step, JSON.parse(serialized));
      if (result.ok) {
        last.current = serialized;
        setSavedSerialized(serialized);
        setState({ kind: "saved", at: new Date().toLocaleTimeString() });
      } else setState({ kind: "error", message: result.message });
    }, delayMs);
    return () => clearTimeout(timer);
  }, [serialized, draftId, step, delayMs]);

  async function saveNow(resumeAt: StepSlug, title?: string): Promise<boolean> {
    setState({ kind: "saving" });
    const result = await saveStepAction(draftId, step, JSON.parse(serialized), resumeAt, title);
    if (!result.ok) {
      setState({ kind: "error", message: result.message });
      return false;
    }
    last.current = serialized;
    setSavedSerialized(serialized);
    setState({ kind: "saved", at: new Date().toLocaleTimeString() });
    return true;
  }

  const shown: SaveState = serialized !== savedSerialized && state.kind !== "saving" && state.kind !== "error" ? { kind: "pending" } : state;
  return { state: shown, saveNow };
}
