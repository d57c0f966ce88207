import { createHash, randomBytes } from "node:crypto";
import { z } from "zod";
import { db } from "@/db/knex";
import { recordAudit } from "@/lib/audit/repo";
import { ConflictError, NotFoundError } from "@/lib/errors";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { lockUserRow, type User } from "@/lib/users/repo";
import * as repo from "./repo";

const TOKEN_PREFIX = "sw_";

/** The most live (not revoked) API tokens one user may hold; creating one more is refused. */
export const MAX_LIVE_TOKENS_PER_USER = 10;

/** The settings form for a new token. */
export const createTokenSchema = z.object({
  label: z.string().trim().min(1, { error: "Label: 1 to 80 characters, e.g. 'analysis notebook'." }).max(80, {
    error: "Label: 1 to 80 characters.",
  }),
});

/** SHA-256 hex of a token secret. @example hashToken("sw_abc") // "9f…" */
export function hashToken(secret: string): string {
  return createHash("sha256").update(secret).digest("hex");
}

/**
 * Creates a personal API token; the plain secret is returned once and only its hash is stored. A user holding
 * MAX_LIVE_TOKENS_PER_USER live tokens is refused (409) until one is revoked; the user's row is locked while counting,
 * so two simultaneous requests cannot both pass the cap.
 * @example const { secret } = await createToken(user, { label: "notebook" });
 */
export async function createToken(user: User, raw: unknown): Promise<{ id: number; secret: string }> {
  const { label } = parseOrThrow(createTokenSchema, raw);
  const secret = TOKEN_PREFIX + randomBytes(24).toString("base64url");
  return db.transaction(async (trx) => {
    await lockUserRow(trx, user.id);
    const live = await repo.countLiveTokens(trx, user.id);
    if (live >= MAX_LIVE_TOKENS_PER_USER) {
      throw new ConflictError(
        `You already have ${live} live API tokens, the most allowed is ${MAX_LIVE_TOKENS_PER_USER}. Revoke one you no longer use, then create the new one.`,
      );
    }
    const id = await repo.insertToken(trx, { userId: user.id, label, hash: hashToken(secret), prefix: secret.slice(0, 10) });
    await recordAudit(trx, {
      actor: user,
      action: "token.create",
      entityType: "api_token",
      entityId: id,
      summary: `Created API token "${label}"`,
    });
    return { id, secret };
  });
}

/**
 * Revokes one of the user's own tokens.
 * @example await revokeToken(user, 3);
 */
export async function revokeToken(user: User, tokenId: number): Promise<void> {
  await db.transaction(async (trx) => {
    if (!(await repo.revokeTokenOfUser(trx, user.id, tokenId))) {
      throw new NotFoundError(`No live API token with id ${tokenId} belongs to you.`);
    }
    await recordAudit(trx, { actor: user, action: "token.revoke", entityType: "api_token", entityId: tokenId, summary: "Revoked API token" });
  });
}

/**
 * Resolves a bearer secret to its live token, or null when unknown or revoked.
 * @example const token = await findLiveToken("sw_…");
 */
export async function findLiveToken(secret: string): Promise<repo.ApiToken | null> {
  const token = await repo.findTokenByHash(hashToken(secret));
  return token && !token.revokedAt ? token : null;
}

/** Records a token's last use without delaying the response; a failure there is logged, not raised. */
export function touchTokenLater(tokenId: number): void {
  repo.touchToken(tokenId).catch((err) => console.error("Could not record token use", err));
}

export { listTokensOfUser } from "./repo";
