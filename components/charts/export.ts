// Saving what a chart shows: its data as CSV, the drawing as SVG, or as PNG drawn from that SVG on a canvas at twice
// the screen resolution. Browser only (the chart components call these from click handlers).
import { toCsv, type CsvCell } from "./csv";

export function downloadBlob(filename: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function downloadCsv(filename: string, rows: readonly (readonly CsvCell[])[]): void {
  downloadBlob(filename, new Blob([toCsv(rows)], { type: "text/csv;charset=utf-8" }));
}

/** The chart's SVG as a standalone document: explicit size, white background, the page's font. */
export function svgMarkup(root: HTMLElement): { markup: string; width: number; height: number } | null {
  const svg = root.querySelector<SVGSVGElement>("svg.recharts-surface") ?? root.querySelector<SVGSVGElement>("svg");
  if (!svg) return null;
  const { width, height } = svg.getBoundingClientRect();
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  copy.setAttribute("width", String(Math.round(width)));
  copy.setAttribute("height", String(Math.round(height)));
  copy.setAttribute("style", `font-family: ${getComputedStyle(root).fontFamily}; font-size: 12px; background: #fff`);
  const background = document.createElementNS("http://www.w3.org/2000/svg", "rect");
  background.setAttribute("width", "100%");
  background.setAttribute("height", "100%");
  background.setAttribute("fill", "#ffffff");
  copy.insertBefore(background, copy.firstChild);
  return { markup: new XMLSerializer().serializeToString(copy), width, height };
}

export function downloadSvg(root: HTMLElement, filename: string): void {
  const svg = svgMarkup(root);
  if (svg) downloadBlob(filename, new Blob([svg.markup], { type: "image/svg+xml;charset=utf-8" }));
}

export async function downloadPng(root: HTMLElement, filename: string, scale = 2): Promise<void> {
  const svg = svgMarkup(root);
  if (!svg) return;
  const url = URL.createObjectURL(new Blob([svg.markup], { type: "image/svg+xml;charset=utf-8" }));
  try {
    const image = new Image();
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error("the chart could not be drawn as an image"));
      image.src = url;
    });
    const canvas = document.createElement("canvas");
    canvas.width = Math.round(svg.width * scale);
    canvas.height = Math.round(svg.height * scale);
    const context = canvas.getContext("2d");
    if (!context) return;
    context.fillStyle = "#ffffff";
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/png"));
    if (blob) downloadBlob(filename, blob);
  } finally {
    URL.revokeObjectURL(url);
  }
}
