/**
 * What an uploaded file is, decided by its bytes and not by the name or the type the client claims: the signatures
 * of PNG, JPEG, GIF and WebP images (their specifications' magic numbers), PDF ("%PDF-", ISO 32000-1 §7.5.2), and
 * plain-text data (spectra exported as CSV, JCAMP-DX or text: valid UTF-8 with no NUL or other control bytes
 * besides tab, CR and LF). Anything else is refused.
 */

export type AttachmentKind = "image" | "pdf" | "text";

export interface SniffedType {
  mediaType: string;
  kind: AttachmentKind;
}

const startsWith = (b: Uint8Array, sig: readonly number[], at = 0) => sig.every((v, i) => b[at + i] === v);

const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG = [0xff, 0xd8, 0xff];
const GIF87 = [0x47, 0x49, 0x46, 0x38, 0x37, 0x61];
const GIF89 = [0x47, 0x49, 0x46, 0x38, 0x39, 0x61];
const RIFF = [0x52, 0x49, 0x46, 0x46];
const WEBP = [0x57, 0x45, 0x42, 0x50];
const PDF = [0x25, 0x50, 0x44, 0x46, 0x2d];

function isPlainText(bytes: Uint8Array): boolean {
  for (const b of bytes) if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d) return false;
  try {
    new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
}

/** The type of a file from its content, or null when it is none of the kinds kept. */
export function sniffType(bytes: Uint8Array): SniffedType | null {
  if (bytes.byteLength === 0) return null;
  if (startsWith(bytes, PNG)) return { mediaType: "image/png", kind: "image" };
  if (startsWith(bytes, JPEG)) return { mediaType: "image/jpeg", kind: "image" };
  if (startsWith(bytes, GIF87) || startsWith(bytes, GIF89)) return { mediaType: "image/gif", kind: "image" };
  if (startsWith(bytes, RIFF) && startsWith(bytes, WEBP, 8)) return { mediaType: "image/webp", kind: "image" };
  if (startsWith(bytes, PDF)) return { mediaType: "application/pdf", kind: "pdf" };
  if (isPlainText(bytes)) return { mediaType: "text/plain; charset=utf-8", kind: "text" };
  return null;
}

/** A thumbnail must itself be a small PNG or JPEG. */
export function isThumbnail(bytes: Uint8Array): boolean {
  const t = sniffType(bytes);
  return t !== null && (t.mediaType === "image/png" || t.mediaType === "image/jpeg");
}
