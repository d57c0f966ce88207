import type { Capability } from "@/lib/auth/roles";
import { can, type Role } from "@/lib/auth/roles";

/** One entry in the signed-in navigation. */
export interface NavItem {
  href: string;
  label: string;
  capability?: Capability;
}

/** The whole navigation; each role sees only the entries it may use. */
export const NAV_ITEMS: NavItem[] = [
  { href: "/home", label: "Home" },
  { href: "/planner", label: "Planner", capability: "plan.run" },
  { href: "/protocols", label: "Protocols", capability: "protocol.read" },
  { href: "/review", label: "Review queue", capability: "review.read" },
  { href: "/bench", label: "Bench", capability: "bench.read" },
  { href: "/library/populations", label: "Libraries", capability: "library.read" },
  { href: "/audit", label: "Audit trail", capability: "audit.read" },
  { href: "/mail", label: "Mail", capability: "mail.read" },
  { href: "/admin/users", label: "Users", capability: "users.manage" },
  { href: "/api-docs", label: "API", capability: "api.compute" },
];

/**
 * Navigation entries visible to `role`.
 * @example navFor("technician").map((i) => i.href) // ["/home", "/bench"]
 */
export function navFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => !item.capability || can(role, item.capability));
}
