import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { orPageError } from "@/lib/http/page-errors";
import { ItemForm } from "@/components/library/item-form";
import { requirePageUser } from "@/lib/auth/session";
import { formDefaults } from "@/lib/library/form-defaults";
import { isLibraryKind, kindInfo, type LibraryKind } from "@/lib/library/kinds";
import { getItem } from "@/lib/library/service";
import { isItemVersionInApprovedUse } from "@/lib/library/usage";

export const metadata: Metadata = { title: "Edit library item" };

async function load(kind: LibraryKind, id: number) {
  return orPageError(getItem(kind, id));
}

export default async function EditItemPage({ params }: { params: Promise<{ kind: string; id: string }> }) {
  const { kind, id: idText } = await params;
  if (!isLibraryKind(kind) || !/^\d+$/.test(idText)) notFound();
  await requirePageUser("library.edit");
  const id = Number(idText);
  const item = await load(kind, id);
  const inUse = await isItemVersionInApprovedUse(kind, id, item.currentVersion);
  const info = kindInfo(kind);
  return (
    <div className="space-y-5">
      <p className="text-sm"><Link href={`/library/${kind}/${id}`}>← {item.name}</Link></p>
      <header>
        <h1>Edit {info.singular}: {item.name}</h1>
        <p className="mt-1 text-ink-soft">Editing version {item.currentVersion}. Saving adds version {item.currentVersion + 1} unless you choose to correct this one in place.</p>
        {inUse && <p className="notice mt-3">Version {item.currentVersion} is used by a protocol version in review or signed. Your edit will be saved as a new version; the protocol keeps its snapshot.</p>}
      </header>
      <ItemForm kind={kind} defaults={formDefaults(kind, item.current as never)} editing={{ id, version: item.currentVersion, inUse, baseFitted: item.current.provenance.kind === "fitted" }} />
    </div>
  );
}
