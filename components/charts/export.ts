// Saving what a chart shows: its data as CSV, the drawing as SVG, or as PNG drawn from that SVG on a canvas at twice
// the screen resolution. Browser only (the chart components call these from click handlers).
import { toCsv, type CsvCell } from "./csv";
import { legendLayout, roughTextWidth, type LegendItem, type PlacedLegendItem } from "./legend";
import { CHART_BACKGROUND, LEGEND_TEXT } from "./palette";

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

/** The chart's own drawing surface (not a legend swatch). */
function chartSurface(root: HTMLElement): SVGSVGElement | null {
  return root.querySelector<SVGSVGElement>(".recharts-wrapper > svg.recharts-surface") ?? root.querySelector<SVGSVGElement>("svg[data-chart-surface]") ?? root.querySelector<SVGSVGElement>("svg");
}

/** The legend the frame drew in HTML beside the chart (data-legend-item carries each entry). */
function legendItems(root: HTMLElement): LegendItem[] {
  return [...root.querySelectorAll<HTMLElement>("[data-legend-item]")].map((item) => ({
    label: item.dataset["label"] ?? item.textContent?.trim() ?? "",
    color: item.dataset["color"] ?? "#000000",
    mark: (item.dataset["mark"] as LegendItem["mark"]) ?? "dot",
  }));
}

/** Text width in the page's font, measured on a canvas; a rough estimate where there is none. */
function measurer(font: string): (text: string) => number {
  const context = document.createElement("canvas").getContext("2d");
  if (!context) return roughTextWidth;
  context.font = font;
  return (text) => context.measureText(text).width;
}

function legendMark(item: PlacedLegendItem): SVGElement {
  const cy = item.y - 4;
  if (item.mark === "line" || item.mark === "dash") {
    const line = document.createElementNS(SVG_NS, "line");
    for (const [k, v] of [["x1", item.x], ["x2", item.x + 12], ["y1", cy], ["y2", cy]] as const) line.setAttribute(k, String(v));
    line.setAttribute("stroke", item.color);
    line.setAttribute("stroke-width", "2");
    if (item.mark === "dash") line.setAttribute("stroke-dasharray", "4 3");
    return line;
  }
  if (item.mark === "bar") {
    const rect = document.createElementNS(SVG_NS, "rect");
    for (const [k, v] of [["x", item.x], ["y", cy - 5], ["width", 12], ["height", 10]] as const) rect.setAttribute(k, String(v));
    rect.setAttribute("fill", item.color);
    return rect;
  }
  const dot = document.createElementNS(SVG_NS, "circle");
  for (const [k, v] of [["cx", item.x + 6], ["cy", cy], ["r", 5]] as const) dot.setAttribute(k, String(v));
  dot.setAttribute("fill", item.color);
  return dot;
}

/** The chart's SVG as a standalone document: explicit size, white background, the page's font, its legend inside. */
export function svgMarkup(root: HTMLElement): { markup: string; width: number; height: number } | null {
  const svg = chartSurface(root);
  if (!svg) return null;
  const box = svg.getBoundingClientRect();
  const fontFamily = getComputedStyle(root).fontFamily;
  const layout = legendLayout(legendItems(root), box.width, measurer(`12px ${fontFamily}`));
  const width = Math.ceil(Math.max(box.width, layout.minWidth));
  const height = Math.ceil(box.height + layout.height);
  const copy = svg.cloneNode(true) as SVGSVGElement;
  copy.setAttribute("xmlns", SVG_NS);
  copy.setAttribute("width", String(width));
  copy.setAttribute("height", String(height));
  copy.setAttribute("viewBox", `0 0 ${width} ${height}`);
  copy.setAttribute("style", `font-family: ${fontFamily}; font-size: 12px; background: ${CHART_BACKGROUND}`);
  const body = document.createElementNS(SVG_NS, "g");
  body.setAttribute("transform", `translate(0, ${layout.height})`);
  while (copy.firstChild) body.appendChild(copy.firstChild);
  const background = document.createElementNS(SVG_NS, "rect");
  background.setAttribute("width", "100%");
  background.setAttribute("height", "100%");
  background.setAttribute("fill", CHART_BACKGROUND);
  const legend = document.createElementNS(SVG_NS, "g");
  legend.setAttribute("data-legend", "");
  for (const item of layout.placed) {
    const text = document.createElementNS(SVG_NS, "text");
    text.setAttribute("x", String(item.x + 18));
    text.setAttribute("y", String(item.y));
    text.setAttribute("fill", LEGEND_TEXT);
    text.textContent = item.label;
    legend.append(legendMark(item), text);
  }
  copy.append(background, body, legend);
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
    context.fillStyle = CHART_BACKGROUND;
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, "image/png"));
    if (blob) downloadBlob(filename, blob);
  } finally {
    URL.revokeObjectURL(url);
  }
}
