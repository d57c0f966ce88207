"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { approveVersionAction } from "@/lib/protocols/actions";
import { SIGNATURE_MEANINGS } from "@/lib/protocols/schemas";
import { ActionStatus } from "@/components/protocols/action-status";
import { useHydrated } from "@/components/forms/use-hydrated";

/** The electronic signature: the reviewer states the meaning and re-enters their password. */
export function ApproveForm({ versionId, lockVersion, number, hash }: { versionId: number; lockVersion: number; number: number; hash: string }) {
  const hydrated = useHydrated();
  const router = useRouter();
  const [meaning, setMeaning] = useState<string>(SIGNATURE_MEANINGS[0]);
  const [password, setPassword] = useState("");
  const [status, setStatus] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, start] = useTransition();
  return (
    <form
      id="sign"
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        start(async () => {
          const r = await approveVersionAction({ versionId, lockVersion, meaning, password });
          setPassword("");
          setStatus({ ok: r.ok, text: r.ok ? r.message ?? "" : r.fieldErrors?.password ?? r.message });
          if (r.ok) router.refresh();
        });
      }}
    >
      <label className="field">
        <span>Meaning of your signature</span>
        <select className="input" value={meaning} onChange={(e) => setMeaning(e.target.value)}>
          {SIGNATURE_MEANINGS.map((m) => <option key={m} value={m}>{m}</option>)}
        </select>
      </label>
      <label className="field">
        <span>Your password</span>
        <input className="input" type="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} />
        <p className="hint">Re-entering your password signs version {number} with content hash <span className="font-mono">{hash.slice(0, 12)}…</span> in your name.</p>
      </label>
      <button type="submit" className="btn" disabled={!hydrated || pending || password.length === 0}>Sign off version {number}</button>
      <ActionStatus status={status} testId="approve-status" />
    </form>
  );
}
