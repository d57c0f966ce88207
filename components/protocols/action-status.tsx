/** The outcome line under a form: green for done, red for refused (with the server's message). */
export function ActionStatus({ status, testId }: { status: { ok: boolean; text: string } | null; testId?: string }) {
  if (!status) return null;
  return (
    <p className={`text-sm ${status.ok ? "text-moss-dark" : "text-danger"}`} role="status" data-testid={testId ?? "action-status"}>
      {status.text}
    </p>
  );
}
