"use client";

import { signOut } from "next-auth/react";

/** Signs out and returns to the sign-in page. */
export function SignOutButton() {
  return (
    <button type="button" className="text-xs text-moss-dark underline-offset-2 hover:underline" onClick={() => signOut({ callbackUrl: "/login" })}>
      Sign out
    </button>
  );
}
