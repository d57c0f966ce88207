/** An /api/v1 call that failed: the HTTP status, the server's message and its field issues. */
export class ApiCallError extends Error {
  constructor(readonly status: number, message: string, readonly issues: { path: string; message: string }[] = []) {
    super(message);
  }
}

/**
 * POSTs JSON to an /api/v1 route with the session cookie; throws ApiCallError with the server's message on failure.
 * @example const spectra = await postJson<SpectraResult>("/api/v1/spectra", body, signal);
 */
export async function postJson<T>(url: string, body: unknown, signal?: AbortSignal): Promise<T> {
  const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body), signal, credentials: "same-origin" });
  const text = await res.text();
  let data: unknown = null;
  try {
    data = text ? JSON.parse(text) : null;
  } catch {
    throw new ApiCallError(res.status, `The server answered ${res.status} with something that is not JSON.`);
  }
  if (!res.ok) {
    const d = (data ?? {}) as { message?: string; issues?: { path: string; message: string }[] };
    throw new ApiCallError(res.status, d.message ?? `The server answered ${res.status}.`, d.issues ?? []);
  }
  return data as T;
}
