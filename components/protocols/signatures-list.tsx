import { ROLE_LABELS } from "@/lib/auth/roles";
import { formatDateTime } from "@/lib/format/time";
import type { Signature } from "@/lib/protocols/mapper";

/** Every signature on a version: signer, role, meaning, time and the content hash signed. */
export function SignaturesList({ signatures, currentHash }: { signatures: Signature[]; currentHash: string }) {
  if (signatures.length === 0) return <p className="text-sm text-ink-muted">Not signed yet.</p>;
  return (
    <ul className="space-y-3">
      {signatures.map((s) => (
        <li key={s.id} className="rounded-md border border-moss/30 bg-moss-light/50 p-3 text-sm" data-testid="signature">
          <p className="font-medium">{s.meaning}</p>
          <p>{s.signerName} · {ROLE_LABELS[s.signerRole]} · {formatDateTime(s.signedAt)}</p>
          <p className="mt-1 break-all font-mono text-xs text-ink-soft">SHA-256 {s.contentHash}</p>
          {s.contentHash !== currentHash && <p className="mt-1 font-medium text-danger">This hash differs from the content shown.</p>}
        </li>
      ))}
    </ul>
  );
}
