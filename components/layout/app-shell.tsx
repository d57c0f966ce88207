import Link from "next/link";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { navFor } from "@/lib/navigation";
import { NavLinks } from "./nav-links";
import { SignOutButton } from "./sign-out-button";
import { Wordmark } from "./wordmark";

/** The signed-in frame: a left rail with the role's navigation, the user and sign-out. */
export function AppShell({ user, children }: { user: { name: string; email: string; role: Role }; children: React.ReactNode }) {
  const items = navFor(user.role);
  return (
    <div className="flex min-h-screen">
      <aside className="flex w-56 shrink-0 flex-col border-r border-paper-line bg-paper-deep/60 px-4 py-5">
        <Link href="/home" className="mb-6 no-underline" aria-label="Sievewright home">
          <Wordmark size={26} />
        </Link>
        <nav aria-label="Main" className="flex-1">
          <NavLinks items={items.map(({ href, label }) => ({ href, label }))} />
        </nav>
        <div className="mt-6 border-t border-paper-line pt-4 text-sm">
          <p className="font-medium" data-testid="current-user">{user.name}</p>
          <p className="text-xs text-ink-soft">{user.email}</p>
          <p className="mt-1"><span className="pill border-moss/40 bg-moss-light text-moss-dark" data-testid="current-role">{ROLE_LABELS[user.role]}</span></p>
          <div className="mt-3 flex gap-2">
            <Link href="/settings" className="text-xs">Settings</Link>
            <SignOutButton />
          </div>
        </div>
      </aside>
      <main className="min-w-0 flex-1 px-8 py-6">{children}</main>
    </div>
  );
}
