/**
 * Attachments of a workup or of its outcome: kept in the database (so both backends and every instance see them)
 * behind the same group walls as the record. Every query is scoped by group; another group's id answers 404.
 * Lists never read the file bytes.
 */
import { createHash } from "node:crypto";
import { type Db } from "@/lib/db/client";
import { NotFoundError, PayloadTooLargeError, UnsupportedMediaTypeError, ValidationError } from "@/lib/errors";
import { isThumbnail, sniffType } from "./content";
import { MAX_ATTACHMENT_BYTES, MAX_THUMBNAIL_BYTES } from "./schemas";

export interface AttachmentInfo {
  id: string;
  workupId: string;
  target: "workup" | "outcome";
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  hasThumbnail: boolean;
  createdAt: string;
  createdBy: string | null;
}

const INFO_SELECT = {
  id: true, workupId: true, target: true, fileName: true, mediaType: true, sizeBytes: true, sha256: true, createdAt: true, createdById: true,
} as const;

type InfoRow = { id: string; workupId: string; target: "workup" | "outcome"; fileName: string; mediaType: string; sizeBytes: number; sha256: string; createdAt: Date; createdById: string | null };

function infoOf(row: InfoRow, hasThumbnail: boolean, names: Map<string, string>): AttachmentInfo {
  return {
    id: row.id, workupId: row.workupId, target: row.target, fileName: row.fileName, mediaType: row.mediaType, sizeBytes: row.sizeBytes,
    sha256: row.sha256, hasThumbnail, createdAt: row.createdAt.toISOString(), createdBy: row.createdById ? (names.get(row.createdById) ?? null) : null,
  };
}

async function requireWorkup(db: Db, groupId: string, workupId: string): Promise<{ hasOutcome: boolean }> {
  const w = await db.workup.findFirst({ where: { id: workupId, groupId }, select: { id: true, outcome: { select: { id: true } } } });
  if (!w) throw new NotFoundError("No such workup in this group.");
  return { hasOutcome: w.outcome !== null };
}

async function userNames(db: Db, ids: (string | null)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((i): i is string => i !== null))];
  if (wanted.length === 0) return new Map();
  const users = await db.user.findMany({ where: { id: { in: wanted } }, select: { id: true, name: true } });
  return new Map(users.map((u) => [u.id, u.name]));
}

export async function listAttachments(db: Db, groupId: string, workupId: string): Promise<AttachmentInfo[]> {
  await requireWorkup(db, groupId, workupId);
  const rows = await db.attachment.findMany({ where: { groupId, workupId }, select: INFO_SELECT, orderBy: [{ createdAt: "asc" }, { id: "asc" }] });
  const withThumb = new Set((await db.attachment.findMany({ where: { groupId, workupId, thumbnail: { not: null } }, select: { id: true } })).map((r) => r.id));
  const names = await userNames(db, rows.map((r) => r.createdById));
  return rows.map((r) => infoOf(r, withThumb.has(r.id), names));
}

export async function createAttachment(db: Db, who: { groupId: string; userId: string }, workupId: string,
  input: { name: string; target: "workup" | "outcome" }, bytes: Uint8Array<ArrayBuffer>): Promise<AttachmentInfo> {
  if (bytes.byteLength === 0) throw new ValidationError({ file: ["the file is empty"] });
  if (bytes.byteLength > MAX_ATTACHMENT_BYTES) throw new PayloadTooLargeError("An attachment may be at most 10 MB.");
  const type = sniffType(bytes);
  if (!type) throw new UnsupportedMediaTypeError("Attach images (PNG, JPEG, GIF, WebP), PDF or plain-text data files; this file's content is none of these.");
  const { hasOutcome } = await requireWorkup(db, who.groupId, workupId);
  if (input.target === "outcome" && !hasOutcome) throw new ValidationError({ target: ["this workup has no outcome yet: report it first, or attach the file to the workup"] });
  const row = await db.attachment.create({
    data: {
      groupId: who.groupId, workupId, target: input.target, fileName: input.name, mediaType: type.mediaType, sizeBytes: bytes.byteLength,
      sha256: createHash("sha256").update(bytes).digest("hex"), data: bytes, createdById: who.userId,
    },
    select: INFO_SELECT,
  });
  return infoOf(row, false, await userNames(db, [row.createdById]));
}

export async function getAttachmentFile(db: Db, groupId: string, id: string): Promise<{ fileName: string; mediaType: string; data: Uint8Array }> {
  const row = await db.attachment.findFirst({ where: { id, groupId }, select: { fileName: true, mediaType: true, data: true } });
  if (!row) throw new NotFoundError("No such attachment in this group.");
  return row;
}

export async function getThumbnail(db: Db, groupId: string, id: string): Promise<Uint8Array> {
  const row = await db.attachment.findFirst({ where: { id, groupId }, select: { thumbnail: true } });
  if (!row?.thumbnail) throw new NotFoundError("No thumbnail for this attachment.");
  return row.thumbnail;
}

/** Stores the preview the uploading browser made; only images get one, and it must itself be a small PNG or JPEG. */
export async function setThumbnail(db: Db, groupId: string, id: string, bytes: Uint8Array<ArrayBuffer>): Promise<void> {
  if (bytes.byteLength > MAX_THUMBNAIL_BYTES) throw new PayloadTooLargeError("A thumbnail may be at most 200 kB.");
  if (!isThumbnail(bytes)) throw new UnsupportedMediaTypeError("A thumbnail must be a PNG or JPEG image.");
  const row = await db.attachment.findFirst({ where: { id, groupId }, select: { mediaType: true } });
  if (!row) throw new NotFoundError("No such attachment in this group.");
  if (!row.mediaType.startsWith("image/")) throw new ValidationError({ thumbnail: ["only image attachments have thumbnails"] });
  await db.attachment.updateMany({ where: { id, groupId }, data: { thumbnail: bytes } });
}

export async function deleteAttachment(db: Db, groupId: string, id: string): Promise<void> {
  const { count } = await db.attachment.deleteMany({ where: { id, groupId } });
  if (count === 0) throw new NotFoundError("No such attachment in this group.");
}

/** Content-Disposition for a stored name: an ASCII fallback and the exact name in RFC 6266/5987 form. */
export function contentDisposition(kind: "attachment" | "inline", fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, "_");
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}
