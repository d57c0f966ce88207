import { z } from "zod";
import { ROLES } from "@/lib/auth/roles";

/** Sign-in form and credentials provider input. */
export const signInSchema = z.object({
  email: z.email({ error: "Email: enter an address such as name@lab.org." }).max(254),
  password: z.string().min(1, { error: "Password: enter your password." }).max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

/** Admin's "new user" form, the action and any future API share this. */
export const createUserSchema = z.object({
  email: z.email({ error: "Email: enter an address such as name@lab.org." }).max(254).transform((s) => s.toLowerCase()),
  name: z.string().trim().min(2, { error: "Name: 2 to 120 characters." }).max(120, { error: "Name: 2 to 120 characters." }),
  role: z.enum(ROLES, { error: `Role: one of ${ROLES.join(", ")}.` }),
  password: z
    .string()
    .min(12, { error: "Password: at least 12 characters." })
    .max(200, { error: "Password: at most 200 characters." }),
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

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
