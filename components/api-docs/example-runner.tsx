"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { abbreviateJson, readableJson } from "@/lib/api/present";

interface RunResult {
  status: number;
  elapsedMs: number;
  serverTiming: string | null;
  engineVersion: string | null;
  body: unknown;
}

async function run(path: string, text: string): Promise<RunResult> {
  const started = performance.now();
  const res = await fetch(path, { method: "POST", headers: { "content-type": "application/json" }, body: text, credentials: "same-origin" });
  const raw = await res.text();
  let body: unknown = raw;
  try {
    body = JSON.parse(raw);
  } catch {
    // Not JSON (should not happen for this API): show the raw text.
  }
  return {
    status: res.status,
    elapsedMs: performance.now() - started,
    serverTiming: res.headers.get("server-timing"),
    engineVersion: res.headers.get("x-engine-version"),
    body,
  };
}

function statusTone(status: number): string {
  if (status < 300) return "border-moss/40 bg-moss-light text-moss-dark";
  if (status < 500) return "border-caution/40 bg-caution-light text-caution";
  return "border-danger/40 bg-danger-light text-danger";
}

/** Sends an example request with the signed-in session and shows the status, timing and a shortened response. */
export function ExampleRunner({ path, body, operationId }: { path: string; body: unknown; operationId: string }) {
  const [text, setText] = useState(() => readableJson(body));
  const mutation = useMutation({ mutationFn: () => run(path, text) });
  const result = mutation.data;
  const serverMs = result?.serverTiming?.match(/app;dur=([\d.]+)/)?.[1];

  return (
    <div className="space-y-3" data-testid={`runner-${operationId}`}>
      <details className="rounded-md border border-paper-line bg-paper/60">
        <summary className="cursor-pointer px-3 py-2 text-sm text-ink-soft">Request body (edit it to try your own values)</summary>
        <label className="block px-3 pb-3">
          <span className="sr-only">Request body for {path}</span>
          <textarea
            className="input h-64 font-mono text-xs"
            spellCheck={false}
            value={text}
            onChange={(e) => setText(e.target.value)}
          />
        </label>
      </details>
      <div className="flex flex-wrap items-center gap-3">
        <button type="button" className="btn" disabled={mutation.isPending} onClick={() => mutation.mutate()}>
          {mutation.isPending ? "Running…" : "Run this example"}
        </button>
        <button type="button" className="btn-quiet" disabled={mutation.isPending} onClick={() => setText(readableJson(body))}>
          Reset body
        </button>
        {result && (
          <p className="flex flex-wrap items-center gap-2 text-sm text-ink-soft" role="status">
            <span className={`pill ${statusTone(result.status)}`} data-testid="run-status">HTTP {result.status}</span>
            <span>{Math.round(result.elapsedMs)} ms round trip{serverMs ? ` · ${serverMs} ms on the server` : ""}</span>
            {result.engineVersion && <span>· engine {result.engineVersion}</span>}
          </p>
        )}
        {mutation.isError && <p className="text-sm text-danger" role="alert">Could not reach the server: {String(mutation.error)}</p>}
      </div>
      {result && (
        <pre className="max-h-96 overflow-auto rounded-md border border-paper-line bg-white p-3 text-xs leading-relaxed" data-testid="run-response">
          {abbreviateJson(result.body)}
        </pre>
      )}
    </div>
  );
}
