// Server-side SVG depictions, served as images (an <img> cannot run anything an SVG might contain). Drawn by RDKit
// from the stored structure and kept in a small per-process cache keyed by the row's last change.
import { depictSvg, loadRDKit, StructureError } from "@/lib/chem/structure";
import { z } from "zod";

export const depictionParamsSchema = z.object({
  w: z.coerce.number().int().min(50).max(1200).default(300),
  h: z.coerce.number().int().min(50).max(1200).default(220),
  /** Comma-separated 0-based atom indices to highlight (an ionizable site). */
  highlight: z
    .string()
    .regex(/^\d{1,4}(,\d{1,4}){0,63}$/, { error: "highlight is a comma-separated list of atom numbers" })
    .optional()
    .transform((s) => (s ? s.split(",").map(Number) : [])),
});
export type DepictionParams = z.output<typeof depictionParamsSchema>;

const CACHE_ENTRIES = 500;
const cache = new Map<string, string>();

export async function depictStored(key: string, text: string, params: DepictionParams): Promise<string> {
  const cacheKey = `${key}|${params.w}x${params.h}|${params.highlight.join(",")}`;
  const hit = cache.get(cacheKey);
  if (hit !== undefined) {
    cache.delete(cacheKey); // re-insert: Map order doubles as least-recently-used order
    cache.set(cacheKey, hit);
    return hit;
  }
  const svg = await depict(text, params);
  cache.set(cacheKey, svg);
  if (cache.size > CACHE_ENTRIES) cache.delete(cache.keys().next().value ?? "");
  return svg;
}

/** Draws a structure that is not stored (a search query); a query atom may be drawn, so dummy atoms are allowed. */
export async function depict(text: string, params: DepictionParams): Promise<string> {
  const rdkit = await loadRDKit();
  return depictSvg(rdkit, text, { width: params.w, height: params.h, highlightAtoms: params.highlight, allowDummyAtoms: true });
}

export function svgResponse(svg: string, etag: string | null, request: Request): Response {
  const headers: Record<string, string> = {
    "Content-Type": "image/svg+xml; charset=utf-8",
    "Cache-Control": "private, max-age=300",
    "Content-Security-Policy": "default-src 'none'; style-src 'unsafe-inline'",
    "X-Content-Type-Options": "nosniff",
  };
  if (etag) {
    headers["ETag"] = etag;
    if (request.headers.get("if-none-match") === etag) return new Response(null, { status: 304, headers });
  }
  return new Response(svg, { headers });
}

export { StructureError };
