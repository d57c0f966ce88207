import { withAuth } from "next-auth/middleware";

/** Signed-out visitors to any signed-in page are sent to /login (roles are checked again on the server). */
export default withAuth({ pages: { signIn: "/login" } });

export const config = {
  matcher: ["/((?!login|api|_next|favicon.ico|fonts|robots.txt).*)"],
};
