"use server";

import { revalidatePath } from "next/cache";
import { currentSessionId, requireActionUser } from "@/lib/auth/session";
import { currentClientAddress } from "@/lib/http/client-address";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { setActiveSchema, setRoleSchema } from "./schemas";
import { changeOwnPassword, completePasswordLink, requestPasswordReset } from "./passwords";
import { createUser, setUserActive, setUserRole } from "./service";

/** Admin: create an account (the new user is e-mailed a set-password link; the admin never chooses it). */
export async function createUserAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const admin = await requireActionUser("users.manage");
    const user = await createUser(admin, input);
    revalidatePath("/admin/users");
    return { ok: true, message: `Created ${user.email}; a set-password link is on its way to that address.` };
  });
}

/** Signed-in user: change my own password (current one required). */
export async function changePasswordAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionUser();
    await changeOwnPassword(user, await currentSessionId(), input);
    return { ok: true, message: "Password changed. Your other sessions were signed out, and a notice went to your e-mail address." };
  });
}

/** Anyone holding a one-time link: choose the password (the link's token is the credential). */
export async function completePasswordLinkAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const { email } = await completePasswordLink(input);
    return { ok: true, message: `Password saved for ${email}. Sign in with it now.` };
  });
}

/** Anyone: "forgot password" (the same answer whether or not the address has an account). */
export async function requestPasswordResetAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => ({ ok: true, message: await requestPasswordReset(input, await currentClientAddress()) }));
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
