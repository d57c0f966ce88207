import type { Metadata } from "next";
import { RoleHome } from "@/components/home/role-home";
import { RoleSummary } from "@/components/home/role-summary";
import { requirePageUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage() {
  const user = await requirePageUser();
  return (
    <RoleHome role={user.role} name={user.name}>
      <RoleSummary role={user.role} userId={user.id} />
    </RoleHome>
  );
}
