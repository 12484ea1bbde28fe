"use client";
// Files kept with a workup or its outcome: TLC photos, spectra, exported data. Uploads go to the JSON API as raw
// bytes (the server decides the type from the content); for images the browser also makes a 320 px preview.
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { inputClass } from "@/components/ui/field";
import { formatDateTime } from "@/components/ui/format";
import type { AttachmentInfo } from "@/lib/attachments/service";

const MAX_BYTES = 10 * 1024 * 1024;
const THUMB_PX = 320;

function sizeText(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`;
}

async function thumbnailOf(file: File): Promise<Blob | null> {
  try {
    const bitmap = await createImageBitmap(file);
    const scale = Math.min(1, THUMB_PX / Math.max(bitmap.width, bitmap.height));
    const canvas = document.createElement("canvas");
    canvas.width = Math.max(1, Math.round(bitmap.width * scale));
    canvas.height = Math.max(1, Math.round(bitmap.height * scale));
    canvas.getContext("2d")?.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
    return await new Promise((resolve) => canvas.toBlob((b) => resolve(b), "image/jpeg", 0.8));
  } catch {
    return null;
  }
}

async function errorText(response: Response): Promise<string> {
  try {
    const body = (await response.json()) as { error?: { message?: string; fields?: Record<string, string[]> } };
    const fields = Object.values(body.error?.fields ?? {}).flat();
    return [body.error?.message, ...fields].filter(Boolean).join(" ") || `The server answered ${response.status}.`;
  } catch {
    return `The server answered ${response.status}.`;
  }
}

export function Attachments({ workupId, initial, writer, hasOutcome }: { workupId: string; initial: AttachmentInfo[]; writer: boolean; hasOutcome: boolean }) {
  const router = useRouter();
  const id = useId();
  const [items, setItems] = useState(initial);
  const [target, setTarget] = useState<"workup" | "outcome">("workup");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState("");

  async function upload(files: FileList | null) {
    if (!files || files.length === 0) return;
    setBusy(true);
    const notes: string[] = [];
    for (const file of Array.from(files)) {
      if (file.size > MAX_BYTES) { notes.push(`${file.name}: larger than 10 MB, not attached.`); continue; }
      const response = await fetch(`/api/v1/workups/${workupId}/attachments?name=${encodeURIComponent(file.name)}&target=${target}`, {
        method: "POST", headers: { "Content-Type": "application/octet-stream" }, body: file,
      });
      if (!response.ok) { notes.push(`${file.name}: ${await errorText(response)}`); continue; }
      let created = (await response.json()) as AttachmentInfo;
      if (created.mediaType.startsWith("image/")) {
        const thumb = await thumbnailOf(file);
        if (thumb) {
          const put = await fetch(`/api/v1/attachments/${created.id}/thumbnail`, { method: "PUT", headers: { "Content-Type": "image/jpeg" }, body: thumb });
          if (put.ok) created = { ...created, hasThumbnail: true };
        }
      }
      setItems((list) => [...list, created]);
      notes.push(`${file.name}: attached.`);
    }
    setMessage(notes.join(" "));
    setBusy(false);
    router.refresh();
  }

  async function remove(item: AttachmentInfo) {
    if (!window.confirm(`Delete ${item.fileName}? This cannot be undone.`)) return;
    const response = await fetch(`/api/v1/attachments/${item.id}`, { method: "DELETE" });
    if (!response.ok) { setMessage(`${item.fileName}: ${await errorText(response)}`); return; }
    setItems((list) => list.filter((i) => i.id !== item.id));
    setMessage(`${item.fileName}: deleted.`);
  }

  return (
    <div className="space-y-3">
      {items.length === 0 ? <p className="text-sm text-stone-600">No files attached.</p> : (
        <ul className="grid gap-3 sm:grid-cols-2" aria-label="Attached files" data-testid="attachments">
          {items.map((a) => (
            <li key={a.id} className="flex gap-3 rounded border border-stone-200 p-2 text-sm">
              <a href={`/api/v1/attachments/${a.id}`} className="shrink-0" target="_blank" rel="noreferrer">
                {a.hasThumbnail
                  // eslint-disable-next-line @next/next/no-img-element -- a stored preview behind the API's guard; next/image would proxy it without the session
                  ? <img src={`/api/v1/attachments/${a.id}/thumbnail`} alt={`Preview of ${a.fileName}`} className="h-16 w-16 rounded object-cover" />
                  : <span className="flex h-16 w-16 items-center justify-center rounded bg-stone-100 text-xs font-semibold text-stone-700">{a.mediaType === "application/pdf" ? "PDF" : a.mediaType.startsWith("image/") ? "IMG" : "TXT"}</span>}
              </a>
              <div className="min-w-0">
                <a href={`/api/v1/attachments/${a.id}?download=1`} className="block truncate font-medium text-teal-800 underline">{a.fileName}</a>
                <p className="text-xs text-stone-600">{sizeText(a.sizeBytes)} · {a.target === "outcome" ? "outcome" : "workup"} · {a.createdBy ?? "unknown"}, {formatDateTime(a.createdAt)}</p>
                {writer ? <button type="button" onClick={() => void remove(a)} className="text-xs text-red-700 underline">Delete</button> : null}
              </div>
            </li>
          ))}
        </ul>
      )}
      {writer ? (
        <div className="flex flex-wrap items-end gap-2">
          <div>
            <label htmlFor={`${id}-file`} className="block text-xs font-medium text-stone-700">Attach files (images, PDF, text data; up to 10 MB each)</label>
            <input id={`${id}-file`} type="file" multiple disabled={busy} accept="image/png,image/jpeg,image/gif,image/webp,application/pdf,text/plain,text/csv,.jdx,.dx,.txt,.csv"
              onChange={(e) => { void upload(e.currentTarget.files); e.currentTarget.value = ""; }} className="mt-0.5 text-sm" />
          </div>
          <div>
            <label htmlFor={`${id}-target`} className="block text-xs font-medium text-stone-700">Belongs to</label>
            <select id={`${id}-target`} value={target} onChange={(e) => setTarget(e.target.value as "workup" | "outcome")} className={`${inputClass} mt-0.5 py-1`}>
              <option value="workup">the workup</option>
              <option value="outcome" disabled={!hasOutcome}>the outcome{hasOutcome ? "" : " (report it first)"}</option>
            </select>
          </div>
          {busy ? <span className="text-xs text-stone-600">Uploading…</span> : null}
        </div>
      ) : null}
      <p role="status" className="text-xs text-stone-700">{message}</p>
    </div>
  );
}
