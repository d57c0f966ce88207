import type { Role } from "@/lib/auth/roles";

declare module "next-auth" {
  interface Session {
    user: { id: number; role: Role; email: string; name: string };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: number;
    role?: string;
    /** Server-side session id (lib/auth/sessions.ts); never copied into the client-visible session. */
    sid?: string;
  }
}
