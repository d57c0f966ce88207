import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ItemForm } from "@/components/library/item-form";
import { requirePageUser } from "@/lib/auth/session";
import { formDefaults } from "@/lib/library/form-defaults";
import { isLibraryKind, kindInfo } from "@/lib/library/kinds";

export const metadata: Metadata = { title: "New library item" };

export default async function NewItemPage({ params }: { params: Promise<{ kind: string }> }) {
  const { kind } = await params;
  if (!isLibraryKind(kind)) notFound();
  await requirePageUser("library.edit");
  const info = kindInfo(kind);
  return (
    <div className="space-y-5">
      <p className="text-sm"><Link href={`/library/${kind}`}>← {info.label}</Link></p>
      <header>
        <h1>New {info.singular}</h1>
        <p className="mt-1 text-ink-soft">The form starts from a typical example; replace the values with your own. Lab units here, SI in storage.</p>
      </header>
      <ItemForm kind={kind} defaults={formDefaults(kind, null)} editing={null} />
    </div>
  );
}
