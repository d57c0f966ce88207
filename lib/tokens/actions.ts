"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requireActionUser } from "@/lib/auth/session";
import { runAction, type ActionResult } from "@/lib/http/action-result";
import { parseOrThrow } from "@/lib/http/zod-issues";
import { createToken, revokeToken } from "./service";

/** Creates a token and returns its secret once. */
export async function createTokenAction(input: unknown): Promise<ActionResult<{ secret: string }>> {
  return runAction(async () => {
    const user = await requireActionUser("api.compute");
    const { secret } = await createToken(user, input);
    revalidatePath("/settings");
    return { ok: true, message: "Token created. Copy it now: it will not be shown again.", data: { secret } };
  });
}

/** Revokes one of the caller's tokens. */
export async function revokeTokenAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionUser();
    const { tokenId } = parseOrThrow(z.object({ tokenId: z.coerce.number().int().positive() }), input);
    await revokeToken(user, tokenId);
    revalidatePath("/settings");
    return { ok: true, message: "Token revoked." };
  });
}
