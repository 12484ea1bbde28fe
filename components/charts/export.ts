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

const SVG_NS = "http://www.w3.org/2000/svg";
const LEGEND_ROW = 24;

/** The chart's own drawing surface (legend icons are small svg elements of their own, inside the HTML legend). */
function chartSurface(root: HTMLElement): SVGSVGElement | null {
  return root.querySelector<SVGSVGElement>(".recharts-wrapper > svg.recharts-surface") ?? root.querySelector<SVGSVGElement>("svg");
}

/** Recharts draws its legend in HTML beside the SVG; an exported image needs it inside. */
function legendItems(root: HTMLElement): { label: string; color: string }[] {
  return [...root.querySelectorAll<HTMLElement>(".recharts-legend-item")].map((item) => ({
    label: item.textContent?.trim() ?? "",
    color: item.querySelector("path, rect, circle")?.getAttribute("fill") ?? "#000000",
  }));
}

/** The chart's SVG as a standalone document: explicit size, white background, the page's font, its legend inside. */
export function svgMarkup(root: HTMLElement): { markup: string; width: number; height: number } | null {
  const svg = chartSurface(root);
  if (!svg) return null;
  const { width, height: chartHeight } = svg.getBoundingClientRect();
  const legend = legendItems(root);
  const offset = legend.length > 0 ? LEGEND_ROW : 0;
  const height = chartHeight + offset;
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("xmlns", SVG_NS);
  copy.setAttribute("width", String(Math.round(width)));
  copy.setAttribute("height", String(Math.round(height)));
  copy.setAttribute("viewBox", `0 0 ${Math.round(width)} ${Math.round(height)}`);
  copy.setAttribute("style", `font-family: ${getComputedStyle(root).fontFamily}; font-size: 12px; background: #fff`);
  const body = document.createElementNS(SVG_NS, "g");
  body.setAttribute("transform", `translate(0, ${offset})`);
  while (copy.firstChild) body.appendChild(copy.firstChild);
  const background = document.createElementNS(SVG_NS, "rect");
  background.setAttribute("width", "100%");
  background.setAttribute("height", "100%");
  background.setAttribute("fill", "#ffffff");
  copy.append(background, body);
  let x = 60;
  for (const item of legend) {
    const dot = document.createElementNS(SVG_NS, "circle");
    dot.setAttribute("cx", String(x));
    dot.setAttribute("cy", "14");
    dot.setAttribute("r", "5");
    dot.setAttribute("fill", item.color);
    const text = document.createElementNS(SVG_NS, "text");
    text.setAttribute("x", String(x + 9));
    text.setAttribute("y", "18");
    text.setAttribute("fill", "#292524");
    text.textContent = item.label;
    copy.append(dot, text);
    x += 24 + item.label.length * 7;
  }
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
