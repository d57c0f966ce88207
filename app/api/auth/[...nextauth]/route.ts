import NextAuth from "next-auth";
import { authOptions } from "@/lib/auth/options";
import { guardAuthRoute } from "@/lib/auth/route-guard";

const handler = guardAuthRoute(NextAuth(authOptions));
export { handler as GET, handler as POST };
