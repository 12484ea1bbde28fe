import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readBodyBytes } from "@/lib/api/body";
import { parseInput } from "@/lib/errors";
import { getThumbnail, setThumbnail } from "@/lib/attachments/service";
import { attachmentParamsSchema, MAX_THUMBNAIL_BYTES } from "@/lib/attachments/schemas";
import { sniffType } from "@/lib/attachments/content";

/** GET /api/v1/attachments/{id}/thumbnail: the small preview of an image attachment (404 when none). */
export const GET = memberRoute<{ id: string }>("data:read", async (_request, { member, params }) => {
  const { id } = parseInput(attachmentParamsSchema, params);
  const bytes = await getThumbnail(await getDb(), member.group.id, id);
  return new Response(bytes as Uint8Array<ArrayBuffer>, {
    headers: { "Content-Type": sniffType(bytes)?.mediaType ?? "application/octet-stream", "X-Content-Type-Options": "nosniff", "Cache-Control": "private, max-age=3600" },
  });
});

/** PUT /api/v1/attachments/{id}/thumbnail with a PNG or JPEG body (at most 200 kB): 204. */
export const PUT = memberRoute<{ id: string }>("data:write", async (request, { member, params }) => {
  const { id } = parseInput(attachmentParamsSchema, params);
  await setThumbnail(await getDb(), member.group.id, id, await readBodyBytes(request, MAX_THUMBNAIL_BYTES));
  return new Response(null, { status: 204 });
}, { bodyTypes: ["image/png", "image/jpeg"] });
