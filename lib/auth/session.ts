import { getServerSession } from "next-auth";
import { forbidden, redirect } from "next/navigation";
import { authOptions } from "./options";
import { can, type Capability } from "./roles";
import { findUserById, type User } from "@/lib/users/repo";
import { ForbiddenError, UnauthenticatedError } from "@/lib/errors";

/**
 * The signed-in user, re-read from the database so a deactivation or role change takes effect at once; null if none.
 * @example const user = await currentUser();
 */
export async function currentUser(): Promise<User | null> {
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (typeof id !== "number") return null;
  const user = await findUserById(id);
  return user && user.active ? user : null;
}

/**
 * For pages: the signed-in user holding `capability`; otherwise redirects to sign-in or renders the 403 page.
 * @example const user = await requirePageUser("users.manage");
 */
export async function requirePageUser(capability?: Capability): Promise<User> {
  const user = await currentUser();
  if (!user) redirect("/login");
  if (capability && !can(user.role, capability)) forbidden();
  return user;
}

/**
 * For server actions: the signed-in user holding `capability`, or a typed error the action turns into a message.
 * @example const actor = await requireActionUser("protocol.author");
 */
export async function requireActionUser(capability?: Capability): Promise<User> {
  const user = await currentUser();
  if (!user) throw new UnauthenticatedError("Your session has ended: sign in again.");
  if (capability && !can(user.role, capability)) {
    throw new ForbiddenError(`Your role (${user.role}) may not do this.`);
  }
  return user;
}
