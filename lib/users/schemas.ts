import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";

/** Sign-in form and credentials provider input. */
export const signInSchema = z.object({
  email: z.email({ error: "Email: enter an address such as name@lab.org." }).max(254),
  password: z.string().min(1, { error: "Password: enter your password." }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

/**
 * Admin's "new user" form, the action and any future API share this. There is no password: the new user chooses it
 * through an e-mailed one-time link (separation of duties).
 */
export const createUserSchema = z.object({
  email: z.email({ error: "Email: enter an address such as name@lab.org." }).max(254).transform((s) => s.toLowerCase()),
  name: z.string().trim().min(2, { error: "Name: 2 to 120 characters." }).max(120, { error: "Name: 2 to 120 characters." }),
  role: z.enum(ROLES, { error: `Role: one of ${ROLES.join(", ")}.` }),
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

const BCRYPT_MAX_BYTES = 72;

/** A new password: 12 characters to 72 bytes (bcrypt reads no further, so a longer one would be silently cut). */
function newPassword(label: string) {
  return z
    .string()
    .min(12, { error: `${label}: at least 12 characters.` })
    .refine((s) => new TextEncoder().encode(s).length <= BCRYPT_MAX_BYTES, {
      error: `${label}: at most ${BCRYPT_MAX_BYTES} bytes (72 plain letters; accented letters and symbols take 2 to 4 bytes each).`,
    });
}

/** Accounts made by the system (demo seed, tests): the one place a password is given at creation. */
export const systemUserSchema = createUserSchema.extend({ password: newPassword("Password") });

/** Choosing a password through an e-mailed link. */
export const setPasswordSchema = z
  .object({
    token: z.string().min(20, { error: "Link: the address is incomplete; open the link from the e-mail again." }).max(200),
    password: newPassword("New password"),
    confirm: z.string().max(400),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "Repeat the new password: the two entries differ." });

/** Settings → change my password. */
export const changePasswordSchema = z
  .object({
    current: z.string().min(1, { error: "Current password: enter it." }).max(200),
    password: newPassword("New password"),
    confirm: z.string().max(400),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "Repeat the new password: the two entries differ." })
  .refine((v) => v.password !== v.current, { path: ["password"], error: "New password: must differ from the current one." });

/** "Forgot your password?" */
export const resetRequestSchema = z.object({
  email: z.email({ error: "Email: enter an address such as name@lab.org." }).max(254).transform((s) => s.trim().toLowerCase()),
});

/** Changing a user's role. */
export const setRoleSchema = z.object({
  userId: z.coerce.number().int().positive(),
  role: z.enum(ROLES, { error: `Role: one of ${ROLES.join(", ")}.` }),
});

/** Activating or deactivating an account. */
export const setActiveSchema = z.object({
  userId: z.coerce.number().int().positive(),
  active: z.enum(["true", "false"]).transform((v) => v === "true"),
});
