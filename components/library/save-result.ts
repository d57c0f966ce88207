import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import type { ActionResult } from "@/lib/http/action-result";

/**
 * Puts a failed save's field errors next to their fields; returns the message for the form's status line.
 * @example const text = applyServerErrors(result, setError);
 */
export function applyServerErrors<T extends FieldValues>(result: ActionResult<unknown>, setError: UseFormSetError<T>): string {
  if (result.ok) return result.message ?? "Saved.";
  for (const [field, message] of Object.entries(result.fieldErrors ?? {})) setError(field as Path<T>, { message });
  return result.message;
}
