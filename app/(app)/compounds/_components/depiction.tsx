/** A compound's structure drawing, served by /api/depict (an image, so the SVG cannot run anything). */
export function Depiction({ compoundId, name, width = 300, height = 220, highlight }: { compoundId: string; name: string; width?: number; height?: number; highlight?: number[] }) {
  const query = new URLSearchParams({ w: String(width), h: String(height) });
  if (highlight?.length) query.set("highlight", highlight.join(","));
  return (
    // eslint-disable-next-line @next/next/no-img-element -- a server-drawn SVG; next/image would only proxy it
    <img src={`/api/depict/compounds/${encodeURIComponent(compoundId)}?${query.toString()}`} alt={`Structure of ${name}`} width={width} height={height} loading="lazy" className="rounded bg-white" />
  );
}
