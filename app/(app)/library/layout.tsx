import { LibraryTabs } from "@/components/library/library-tabs";
import { requirePageUser } from "@/lib/auth/session";

export default async function LibraryLayout({ children }: { children: React.ReactNode }) {
  await requirePageUser("library.read");
  return (
    <div className="max-w-6xl">
      <LibraryTabs />
      {children}
    </div>
  );
}
