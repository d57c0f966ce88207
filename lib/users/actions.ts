"use server";

import { revalidatePath } from "next/cache";
import { requireActionUser } from "@/lib/auth/session";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { setActiveSchema, setRoleSchema } from "./schemas";
import { createUser, setUserActive, setUserRole } from "./service";

/** Admin: create an account. */
export async function createUserAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const admin = await requireActionUser("users.manage");
    const user = await createUser(admin, input);
    revalidatePath("/admin/users");
    return { ok: true, message: `Created ${user.email}.` };
  });
}

/** Admin: change a role (form data: userId, role). */
export async function setRoleAction(form: FormData): Promise<ActionResult> {
  return runAction(async () => {
    const admin = await requireActionUser("users.manage");
    const { userId, role } = parseOrThrow(setRoleSchema, Object.fromEntries(form));
    const user = await setUserRole(admin, userId, role);
    revalidatePath("/admin/users");
    return { ok: true, message: `${user.email} is now ${role}.` };
  });
}

/** Admin: activate or deactivate (form data: userId, active). */
export async function setActiveAction(form: FormData): Promise<ActionResult> {
  return runAction(async () => {
    const admin = await requireActionUser("users.manage");
    const { userId, active } = parseOrThrow(setActiveSchema, Object.fromEntries(form));
    const user = await setUserActive(admin, userId, active);
    revalidatePath("/admin/users");
    return { ok: true, message: `${user.email} ${active ? "can sign in again" : "can no longer sign in"}.` };
  });
}
