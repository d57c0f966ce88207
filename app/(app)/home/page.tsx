import type { Metadata } from "next";
import { RoleHome } from "@/components/home/role-home";
import { requirePageUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage() {
  const user = await requirePageUser();
  return <RoleHome role={user.role} name={user.name} />;
}
