"use client";

import { useState, useTransition } from "react";
import { formatDateTime } from "@/lib/format/time";
import { createTokenAction, revokeTokenAction } from "@/lib/tokens/actions";

interface TokenView {
  id: number;
  label: string;
  prefix: string;
  createdAt: string;
  lastUsedAt: string | null;
  revoked: boolean;
}

/** Personal API tokens: create (secret shown once), list, revoke. */
export function TokenPanel({ tokens }: { tokens: TokenView[] }) {
  const [label, setLabel] = useState("");
  const [secret, setSecret] = useState<string | null>(null);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();

  function create() {
    start(async () => {
      const result = await createTokenAction({ label });
      setMessage({ ok: result.ok, text: result.message ?? "" });
      if (result.ok && result.data) {
        setSecret(result.data.secret);
        setLabel("");
      }
    });
  }

  return (
    <section className="card space-y-4">
      <div>
        <h2>API tokens</h2>
        <p className="text-sm text-ink-soft">
          Send a token as <code>Authorization: Bearer …</code> to call <code>/api/v1</code> from scripts. Only a hash is stored.
        </p>
      </div>
      <div className="flex items-end gap-2">
        <label className="field flex-1">
          <span>Label</span>
          <input className="input" value={label} onChange={(e) => setLabel(e.target.value)} placeholder="e.g. analysis notebook" />
        </label>
        <button type="button" className="btn" disabled={pending} onClick={create}>Create token</button>
      </div>
      {message && <p className={`text-sm ${message.ok ? "text-moss-dark" : "text-danger"}`} role="status">{message.text}</p>}
      {secret && (
        <p className="notice break-all" data-testid="new-token">
          <strong>New token:</strong> <code>{secret}</code>
        </p>
      )}
      <table>
        <thead><tr><th>Label</th><th>Starts with</th><th>Created</th><th>Last used</th><th /></tr></thead>
        <tbody>
          {tokens.length === 0 && <tr><td colSpan={5} className="text-ink-muted">No tokens yet.</td></tr>}
          {tokens.map((t) => (
            <tr key={t.id}>
              <td>{t.label}</td>
              <td><code>{t.prefix}…</code></td>
              <td>{formatDateTime(new Date(t.createdAt))}</td>
              <td>{t.lastUsedAt ? formatDateTime(new Date(t.lastUsedAt)) : "never"}</td>
              <td className="text-right">
                {t.revoked ? <span className="text-xs text-ink-muted">revoked</span> : (
                  <button type="button" className="btn-quiet" disabled={pending} onClick={() => start(async () => {
                    const r = await revokeTokenAction({ tokenId: t.id });
                    setMessage({ ok: r.ok, text: r.message ?? "" });
                  })}>Revoke</button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
