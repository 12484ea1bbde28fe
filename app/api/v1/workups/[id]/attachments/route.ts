import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { queryOf, readBodyBytes } from "@/lib/api/body";
import { parseInput } from "@/lib/errors";
import { createAttachment, listAttachments } from "@/lib/attachments/service";
import { MAX_ATTACHMENT_BYTES, uploadQuerySchema, workupParamsSchema } from "@/lib/attachments/schemas";

/** GET /api/v1/workups/{id}/attachments: the files kept with the workup and its outcome (no bytes). */
export const GET = memberRoute<{ id: string }>("data:read", async (_request, { member, params }) => {
  const { id } = parseInput(workupParamsSchema, params);
  return Response.json({ attachments: await listAttachments(await getDb(), member.group.id, id) });
});

/**
 * POST /api/v1/workups/{id}/attachments?name=tlc.jpg&target=workup|outcome with the file's bytes as an
 * application/octet-stream body (at most 10 MB). The type is decided by the content: images, PDF, plain text.
 * 201 with the attachment; 413 over 10 MB; 415 for another kind of file; nothing is written on any error.
 */
export const POST = memberRoute<{ id: string }>("data:write", async (request, { member, params }) => {
  const { id } = parseInput(workupParamsSchema, params);
  const query = parseInput(uploadQuerySchema, queryOf(request));
  const bytes = await readBodyBytes(request, MAX_ATTACHMENT_BYTES);
  const created = await createAttachment(await getDb(), { groupId: member.group.id, userId: member.user.id }, id, query, bytes);
  return Response.json(created, { status: 201 });
}, { bodyTypes: ["application/octet-stream"] });
