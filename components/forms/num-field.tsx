import type { UseFormRegisterReturn } from "react-hook-form";

/**
 * A labelled number input: the label carries the unit, the hint gives the allowed range, the error sits under the
 * field and is tied to it with aria-describedby.
 */
export function NumField({ id, label, registration, error, hint, step = "any", className = "" }: { id: string; label: string; registration: UseFormRegisterReturn; error?: string; hint?: string; step?: string | number; className?: string }) {
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className={`field ${className}`}>
      <label htmlFor={id} className="mb-1 block font-medium text-ink-soft">{label}</label>
      <input id={id} className="input" type="number" inputMode="decimal" step={step} aria-invalid={error ? true : undefined} aria-describedby={describedBy} {...registration} />
      {hint && <p id={`${id}-hint`} className="hint">{hint}</p>}
      {error && <p id={`${id}-error`} className="field-error">{error}</p>}
    </div>
  );
}

/**
 * Reads the error message at a dotted path of react-hook-form's `errors` object.
 * @example errorAt(errors, "target.radius.mean")
 */
export function errorAt(errors: unknown, path: string): string | undefined {
  const node = path.split(".").reduce<unknown>((o, k) => (o && typeof o === "object" ? (o as Record<string, unknown>)[k] : undefined), errors);
  const message = (node as { message?: unknown } | undefined)?.message;
  return typeof message === "string" ? message : undefined;
}
