/** The five roles of DESIGN.md; stored as these strings in users.role and carried in the session token. */
export const ROLES = ["developer", "reviewer", "technician", "supervisor", "admin"] as const;
export type Role = (typeof ROLES)[number];

/** What each role is called on screen. */
export const ROLE_LABELS: Record<Role, string> = {
  developer: "Assay developer",
  reviewer: "QA reviewer",
  technician: "Technician",
  supervisor: "Supervisor",
  admin: "Admin",
};

/** Every guarded capability in the product, and which roles hold it (DESIGN.md, "Users"). */
export const CAPABILITIES = {
  "plan.run": ["developer"],
  "library.edit": ["developer"],
  "library.read": ["developer", "reviewer", "supervisor"],
  "protocol.author": ["developer"],
  "protocol.read": ["developer", "reviewer", "supervisor"],
  "protocol.readApproved": ["developer", "reviewer", "technician", "supervisor"],
  "review.read": ["reviewer", "supervisor"],
  "review.sign": ["reviewer"],
  "bench.read": ["technician", "supervisor"],
  "run.record": ["technician"],
  "run.read": ["developer", "reviewer", "technician", "supervisor"],
  "audit.read": ["reviewer", "supervisor", "admin"],
  "mail.read": ["supervisor", "admin"],
  "users.manage": ["admin"],
  "api.compute": ["developer", "reviewer", "supervisor"],
} as const satisfies Record<string, readonly Role[]>;
export type Capability = keyof typeof CAPABILITIES;

/**
 * Whether `role` holds `capability`.
 * @example can("technician", "users.manage") // false
 */
export function can(role: Role, capability: Capability): boolean {
  return (CAPABILITIES[capability] as readonly Role[]).includes(role);
}

/** Type guard for a role string read from the database or a token. */
export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLES as readonly string[]).includes(value);
}
