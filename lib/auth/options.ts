import { readEnv } from "@/lib/env";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { isRole } from "./roles";
import { signInErrorText, signInWithPassword } from "./password-checks";
import { authConfig } from "./config";
import { safeRedirectUrl } from "./redirect";
import { endSession, peekSession, startSession } from "./sessions";
import { clientAddress, type HeaderSource } from "@/lib/http/client-address";
import { signInSchema } from "@/lib/users/schemas";
import { isDatabaseUnavailable } from "@/db/outage";
import { SIGN_IN_UNAVAILABLE } from "@/lib/http/outage-codes";
import { servedOverHttps } from "@/lib/http/security-headers";
import { cachedDecode } from "./token-cache";

/**
 * next-auth configuration: credentials against the users table under the attempt limits; the JWT carries a
 * server-side session id (lib/auth/sessions.ts) that every request checks and sign-out ends; redirects only ever go to
 * a path on our own origin. The cookie lives no longer than the session's absolute lifetime.
 */
/** Thrown by the jwt callback for a token whose session ended; next-auth then answers `{}` and clears the cookie. */
class SessionEndedError extends Error {
  constructor(state: string) {
    super(`session ${state}`);
    this.name = "SessionEndedError";
  }
}

export const authOptions: NextAuthOptions = {
  session: { strategy: "jwt", maxAge: authConfig().SESSION_MAX_HOURS * 60 * 60 },
  // Decoding a session token is remembered per token (lib/auth/token-cache.ts); encoding stays next-auth's own.
  jwt: { decode: cachedDecode },
  pages: { signIn: "/login" },
  // Session and CSRF cookies get `Secure` (and the __Secure-/__Host- names) whenever the base URL is https.
  useSecureCookies: servedOverHttps(),
  secret: readEnv().NEXTAUTH_SECRET,
  providers: [
    CredentialsProvider({
      name: "Email and password",
      credentials: { email: { label: "Email", type: "email" }, password: { label: "Password", type: "password" } },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials);
        if (!parsed.success) return null;
        const headers = (req?.headers ?? {}) as Record<string, string | undefined>;
        const address = clientAddress(headers as HeaderSource);
        try {
          const user = await signInWithPassword(parsed.data.email, parsed.data.password, address);
          if (!user) return null;
          const sid = await startSession(user, address, headers["user-agent"] ?? null);
          return { id: String(user.id), email: user.email, name: user.name, role: user.role, sid };
        } catch (err) {
          // next-auth hands this text to the form as `error`; only our own words ever get there.
          throw new Error(isDatabaseUnavailable(err) ? SIGN_IN_UNAVAILABLE : signInErrorText(err));
        }
      },
    }),
  ],
  // An ended session at /api/auth/session is expected (a copied or stale cookie), not a server error worth a stack trace.
  logger: {
    error(code, metadata) {
      const name = (metadata as { name?: string; error?: { name?: string } } | undefined)?.name ?? (metadata as { error?: { name?: string } })?.error?.name;
      if (code === "JWT_SESSION_ERROR" && name === "SessionEndedError") return;
      console.error(`[next-auth][error][${code}]`, metadata);
    },
  },
  events: {
    async signOut({ token }) {
      if (typeof token?.sid === "string") await endSession(token.sid);
    },
  },
  callbacks: {
    redirect({ url, baseUrl }) {
      return safeRedirectUrl(url, baseUrl);
    },
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.role = (user as { role?: string }).role;
        token.sid = (user as { sid?: string }).sid;
        return token;
      }
      // next-auth's own /api/auth/session: a token whose server-side session ended (sign-out, time-out, deactivation)
      // answers "no session" and its cookie is cleared, instead of the user a copied cookie still names.
      // While the database is down nothing can be judged: keep the cookie (every page and API call checks the session
      // again and shows the outage), so users are not signed out by an outage.
      let state: string;
      try {
        state = typeof token.sid === "string" ? await peekSession(token.sid) : "unknown";
      } catch (err) {
        if (isDatabaseUnavailable(err)) return token;
        throw err;
      }
      if (state !== "live") throw new SessionEndedError(state);
      return token;
    },
    async session({ session, token }) {
      if (session.user && typeof token.uid === "number" && isRole(token.role)) {
        session.user.id = token.uid;
        session.user.role = token.role;
      }
      return session;
    },
  },
};
