import { AppShell } from "@/components/layout/app-shell";
import { requirePageUser } from "@/lib/auth/session";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  return <AppShell user={user}>{children}</AppShell>;
}
