import type { SaveState } from "./use-autosave";

/** "Saved 14:02:11" / "Saving…" / the error, announced politely to screen readers. */
export function SaveStatus({ state }: { state: SaveState }) {
  const text =
    state.kind === "saving" ? "Saving draft…" : state.kind === "pending" ? "Unsaved changes — saving shortly…" : state.kind === "saved" ? `Draft saved at ${state.at}` : state.kind === "error" ? `Not saved: ${state.message}` : "Changes are saved to your draft as you type";
  return (
    <p role="status" aria-live="polite" data-testid="save-status" className={`text-xs ${state.kind === "error" ? "text-danger" : "text-ink-muted"}`}>
      {text}
    </p>
  );
}
