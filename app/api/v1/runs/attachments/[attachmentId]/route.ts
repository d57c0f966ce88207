import { apiRoute } from "@/lib/http/api";
import { NotFoundError } from "@/lib/errors";
import { readObject } from "@/lib/storage";
import { findAttachment } from "@/lib/runs/repo";
import { readVersionById } from "@/lib/protocols/queries";

export const runtime = "nodejs";

type Ctx = { params: Promise<{ attachmentId: string }> };

/** GET /api/v1/runs/attachments/{id}: the stored file (SHA-256 checked), for anyone who may see the run's version. */
export const GET = apiRoute("run.read", async (_req, caller, ctx: Ctx) => {
  const id = Number((await ctx.params).attachmentId);
  const attachment = Number.isInteger(id) ? await findAttachment(id) : null;
  if (!attachment) throw new NotFoundError(`No attachment ${id}.`);
  await readVersionById(caller.user, attachment.versionId);
  const { bytes } = await readObject(attachment.storagePath, attachment.sha256);
  const ascii = attachment.fileName.replace(/[^\x20-\x7e]|["\\]/g, "_");
  return new Response(bytes as Uint8Array<ArrayBuffer>, {
    headers: {
      "content-type": attachment.mimeType,
      "content-disposition": `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(attachment.fileName)}`,
      "x-content-type-options": "nosniff",
      "cache-control": "private, no-store",
    },
  });
});
