import type { Knex } from "knex";
import { db } from "@/db/knex";

/** A personal API token as listed on the settings page (never the secret). */
export interface ApiToken {
  id: number;
  userId: number;
  label: string;
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

interface TokenRow {
  id: number;
  user_id: number;
  label: string;
  token_hash: string;
  prefix: string;
  created_at: Date;
  last_used_at: Date | null;
  revoked_at: Date | null;
}

function toToken(row: TokenRow): ApiToken {
  return {
    id: Number(row.id),
    userId: Number(row.user_id),
    label: row.label,
    prefix: row.prefix,
    createdAt: new Date(row.created_at),
    lastUsedAt: row.last_used_at ? new Date(row.last_used_at) : null,
    revokedAt: row.revoked_at ? new Date(row.revoked_at) : null,
  };
}

/** Stores a new token hash; returns its id. */
export async function insertToken(conn: Knex, row: { userId: number; label: string; hash: string; prefix: string }) {
  const [id] = await conn("api_tokens").insert({
    user_id: row.userId,
    label: row.label,
    token_hash: row.hash,
    prefix: row.prefix,
  });
  return Number(id);
}

/** A user's tokens, newest first. */
export async function listTokensOfUser(userId: number): Promise<ApiToken[]> {
  return (await db<TokenRow>("api_tokens").where({ user_id: userId }).orderBy("id", "desc")).map(toToken);
}

/** The token holding this hash, revoked or not. */
export async function findTokenByHash(hash: string): Promise<ApiToken | null> {
  const row = await db<TokenRow>("api_tokens").where({ token_hash: hash }).first();
  return row ? toToken(row) : null;
}

/** Marks a token revoked; returns whether a live token of that user was revoked. */
export async function revokeTokenOfUser(conn: Knex, userId: number, tokenId: number): Promise<boolean> {
  const n = await conn("api_tokens")
    .where({ id: tokenId, user_id: userId })
    .whereNull("revoked_at")
    .update({ revoked_at: conn.fn.now(3) });
  return n > 0;
}

/** Records the time of the latest use. */
export async function touchToken(id: number): Promise<void> {
  await db("api_tokens").where({ id }).update({ last_used_at: db.fn.now(3) });
}

/**
 * How many live (not revoked) tokens a user holds.
 * @example await countLiveTokens(trx, 5); // 3
 */
export async function countLiveTokens(conn: Knex, userId: number): Promise<number> {
  const row = await conn("api_tokens").where({ user_id: userId }).whereNull("revoked_at").count({ n: "*" }).first();
  return Number(row?.n ?? 0);
}
