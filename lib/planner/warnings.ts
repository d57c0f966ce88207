/** Warnings the planner attaches to windows and results. */

/** How serious a warning is. */
export type WarningSeverity = "info" | "caution" | "warning" | "danger";

/** One warning: a stable code, severity, message, the value and limit it compares (SI, or null), and advice. */
export interface PlannerWarning {
  code: string;
  severity: WarningSeverity;
  message: string;
  value: number | null;
  limit: number | null;
  advice: string;
}

/** The statement every planner result carries. */
export const MODEL_PREDICTION_WARNING: PlannerWarning = {
  code: "model-prediction",
  severity: "info",
  message: "All numbers are model predictions from the dipole approximation, the smeared-shell model and order-of-magnitude flow estimates.",
  value: null,
  limit: null,
  advice: "Verify the window on the bench with your own cells and buffer, and follow your institution's biosafety and electrical-safety rules.",
};
