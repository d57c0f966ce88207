import { currentUser } from "@/lib/auth/session";
import { can, type Capability } from "@/lib/auth/roles";
import { ForbiddenError, UnauthenticatedError } from "@/lib/errors";
import { errorResponse } from "./errors";
import { assertContentType, assertSameOrigin } from "@/lib/http/origin";
import { findLiveToken, touchTokenLater } from "@/lib/tokens/service";
import { enforceRateLimit } from "./rate-limit";
import { findUserById, type User } from "@/lib/users/repo";

/** Who called: the user, and the token when the call came with one. */
export interface ApiCaller {
  user: User;
  tokenId: number | null;
}

/**
 * Resolves the caller from `Authorization: Bearer …` or the session cookie and spends one request of its per-minute
 * budget (per token, or per user for cookie sessions; lib/http/rate-limit.ts); throws 401/403/429 errors.
 * @example const caller = await authenticate(req, "api.compute");
 */
export async function authenticate(req: Request, capability: Capability): Promise<ApiCaller> {
  const header = req.headers.get("authorization");
  let caller: ApiCaller | null = null;
  if (header) {
    const match = /^Bearer\s+(\S+)$/i.exec(header);
    if (!match) throw new UnauthenticatedError("Authorization header must be 'Bearer <token>'.");
    const token = await findLiveToken(match[1]);
    if (!token) throw new UnauthenticatedError("The API token is unknown or has been revoked.");
    const user = await findUserById(token.userId);
    if (!user || !user.active) throw new UnauthenticatedError("The account that owns this token is deactivated.");
    await enforceRateLimit({ kind: "token", tokenId: token.id });
    touchTokenLater(token.id);
    caller = { user, tokenId: token.id };
  } else {
    const user = await currentUser();
    if (!user) throw new UnauthenticatedError();
    await enforceRateLimit({ kind: "user", userId: user.id });
    caller = { user, tokenId: null };
  }
  if (!can(caller.user.role, capability)) {
    throw new ForbiddenError(`Your role (${caller.user.role}) may not use this endpoint.`);
  }
  return caller;
}

/** Per-route options of apiRoute. */
export interface ApiRouteOptions {
  /** Media types a state-changing call may send (default: application/json). */
  accepts?: readonly string[];
}

/**
 * Wraps a route handler: authenticate, refuse cross-site cookie calls, run, map errors. The handler returns a plain
 * object (sent as JSON) or a Response.
 * @example export const POST = apiRoute("api.compute", async (req, caller) => ({ ok: true }));
 */
export function apiRoute<C>(
  capability: Capability,
  handler: (req: Request, caller: ApiCaller, ctx: C) => Promise<unknown>,
  options: ApiRouteOptions = {},
): (req: Request, ctx: C) => Promise<Response> {
  return async (req, ctx) => {
    try {
      const caller = await authenticate(req, capability);
      if (caller.tokenId === null) {
        assertSameOrigin(req);
        assertContentType(req, options.accepts ?? ["application/json"]);
      }
      const result = await handler(req, caller, ctx);
      return result instanceof Response ? result : Response.json(result);
    } catch (err) {
      return errorResponse(err);
    }
  };
}
