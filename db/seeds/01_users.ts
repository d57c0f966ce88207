import bcrypt from "bcryptjs";
import type { Knex } from "knex";

/** Demo password shared by every demo account (listed in the README; demo data only). */
export const DEMO_PASSWORD = "sievewright-demo";

/** The demo scenario's people (DESIGN.md): one per role, plus a second reviewer and developer for the four-eyes rules. */
export const DEMO_USERS = [
  { email: "dana.dev@example.test", name: "Dana Devlin", role: "developer" },
  { email: "quinn.qa@example.test", name: "Quinn Abara", role: "reviewer" },
  { email: "tomas.tech@example.test", name: "Tomás Techera", role: "technician" },
  { email: "sam.super@example.test", name: "Sam Superville", role: "supervisor" },
  { email: "ari.admin@example.test", name: "Ari Adminson", role: "admin" },
  { email: "rhea.qa@example.test", name: "Rhea Quist", role: "reviewer" },
  { email: "lee.dev@example.test", name: "Lee Devereux", role: "developer" },
] as const;

export async function seed(knex: Knex): Promise<void> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  // Imported here, not at the top: the e2e helpers import DEMO_PASSWORD from this file without a database.
  const { insertUsers } = await import("../../lib/users/repo");
  await insertUsers(knex, DEMO_USERS, hash);
}
