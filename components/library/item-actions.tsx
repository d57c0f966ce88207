"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { duplicateItemAction, setArchivedAction } from "@/lib/library/actions";
import type { LibraryKind } from "@/lib/library/kinds";

/** Edit, fit, duplicate and archive/restore buttons of an item's page. */
export function ItemActions({ kind, id, archived, canFit }: { kind: LibraryKind; id: number; archived: boolean; canFit: boolean }) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);

  return (
    <div className="flex flex-col items-end gap-2">
      <div className="flex flex-wrap justify-end gap-2">
        {!archived && <Link className="btn" href={`/library/${kind}/${id}/edit`}>Edit</Link>}
        {!archived && canFit && <Link className="btn-quiet no-underline" href={`/library/${kind}/${id}/fit`}>Fit from crossovers</Link>}
        {!archived && canFit && <Link className="btn-quiet no-underline" href={`/library/${kind}/${id}/characterise`}>Characterise from measurements</Link>}
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => start(async () => {
          const r = await duplicateItemAction(kind, id);
          setMessage({ ok: r.ok, text: r.message ?? "" });
          if (r.ok && r.data) router.push(`/library/${kind}/${r.data.id}`);
        })}>Duplicate</button>
        <button type="button" className="btn-quiet" disabled={pending} onClick={() => start(async () => {
          const r = await setArchivedAction(kind, id, !archived);
          setMessage({ ok: r.ok, text: r.message ?? "" });
          router.refresh();
        })}>{archived ? "Restore" : "Archive"}</button>
      </div>
      {message && <p className={`text-sm ${message.ok ? "text-moss-dark" : "text-danger"}`} role="status">{message.text}</p>}
    </div>
  );
}
