import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { parseInput } from "@/lib/errors";
import { contentDisposition, deleteAttachment, getAttachmentFile } from "@/lib/attachments/service";
import { attachmentParamsSchema } from "@/lib/attachments/schemas";

/**
 * GET /api/v1/attachments/{id}[?download=1]: the file as uploaded. Images and PDF open in the browser, anything
 * else downloads; the response is sandboxed and never sniffed, so a stored file cannot run as a page of the app.
 */
export const GET = memberRoute<{ id: string }>("data:read", async (request, { member, params }) => {
  const { id } = parseInput(attachmentParamsSchema, params);
  const file = await getAttachmentFile(await getDb(), member.group.id, id);
  const inline = !new URL(request.url).searchParams.has("download") && (file.mediaType.startsWith("image/") || file.mediaType === "application/pdf");
  return new Response(file.data as Uint8Array<ArrayBuffer>, {
    headers: {
      "Content-Type": file.mediaType,
      "Content-Length": String(file.data.byteLength),
      "Content-Disposition": contentDisposition(inline ? "inline" : "attachment", file.fileName),
      "X-Content-Type-Options": "nosniff",
      "Content-Security-Policy": "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
      "Cache-Control": "private, no-store",
    },
  });
});

/** DELETE /api/v1/attachments/{id}: 204. */
export const DELETE = memberRoute<{ id: string }>("data:write", async (_request, { member, params }) => {
  const { id } = parseInput(attachmentParamsSchema, params);
  await deleteAttachment(await getDb(), member.group.id, id);
  return new Response(null, { status: 204 });
});
