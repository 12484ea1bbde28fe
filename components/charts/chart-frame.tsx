"use client";
// One view of a report: a titled figure with its legend, a sentence or two saying what the chart shows (its text
// summary, read by screen readers as the figure's description and printed under it) and one export menu for its data
// (CSV) and its image (SVG, PNG; both with the legend inside). The menu is hidden when printing.
import { useRef, type ReactNode } from "react";
import { type CsvCell, fileSlug } from "./csv";
import { downloadCsv, downloadPng, downloadSvg } from "./export";
import { type LegendItem } from "./legend";
import { LEGEND_TEXT } from "./palette";

const menuItem =
  "block w-full rounded px-3 py-1.5 text-left text-sm text-stone-800 hover:bg-stone-100 " +
  "focus-visible:outline-2 focus-visible:outline-offset-[-2px] focus-visible:outline-teal-600";

export interface ChartFrameProps {
  title: string;
  /** One sentence on how to read the view. */
  description?: ReactNode;
  /** What the chart shows, in words (counts, extremes, the trend): the figure's text alternative. */
  summary?: string;
  /** The series and marks, drawn above the chart and inside exported images. */
  legend?: readonly LegendItem[];
  /** The view's data, header row first. */
  csv: readonly (readonly CsvCell[])[];
  /** Base of the downloaded files' names. */
  fileBase?: string;
  /** False for a view that is a table only (no image to save). */
  image?: boolean;
  className?: string;
  children: ReactNode;
}

function Swatch({ item }: { item: LegendItem }) {
  const mark = item.mark ?? "dot";
  if (mark === "line" || mark === "dash") {
    return <span aria-hidden className="inline-block w-3.5 border-t-2" style={{ borderColor: item.color, borderTopStyle: mark === "dash" ? "dashed" : "solid" }} />;
  }
  return <span aria-hidden className={`inline-block h-2.5 w-2.5 ${mark === "bar" ? "" : "rounded-full"}`} style={{ backgroundColor: item.color }} />;
}

export function ChartLegend({ items }: { items: readonly LegendItem[] }) {
  return (
    <ul className="mb-2 flex flex-wrap gap-x-4 gap-y-1 text-xs" aria-label="Legend" data-testid="chart-legend">
      {items.map((item) => (
        <li key={item.label} className="flex items-center gap-1.5" style={{ color: LEGEND_TEXT }}
          data-legend-item data-label={item.label} data-color={item.color} data-mark={item.mark ?? "dot"}>
          <Swatch item={item} />
          {item.label}
        </li>
      ))}
    </ul>
  );
}

function ExportMenu({ title, onCsv, onSvg, onPng }: { title: string; onCsv: () => void; onSvg: (() => void) | null; onPng: (() => void) | null }) {
  const menu = useRef<HTMLDetailsElement>(null);
  const run = (action: () => void) => () => {
    action();
    if (menu.current) menu.current.open = false;
  };
  return (
    <details ref={menu} className="relative print:hidden" data-testid="export-menu">
      <summary className="cursor-pointer list-none rounded-md border border-stone-300 bg-white px-2.5 py-1 text-xs font-medium text-stone-700 hover:bg-stone-50 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-teal-600"
        aria-label={`Export ${title}`}>
        Export ▾
      </summary>
      <div className="absolute right-0 z-10 mt-1 w-56 rounded-md border border-stone-200 bg-white p-1 shadow-md" role="group" aria-label={`Export ${title}`}>
        <button type="button" className={menuItem} onClick={run(onCsv)}>Data (CSV)</button>
        {onSvg ? <button type="button" className={menuItem} onClick={run(onSvg)}>Image with legend (SVG)</button> : null}
        {onPng ? <button type="button" className={menuItem} onClick={run(onPng)}>Image with legend (PNG)</button> : null}
      </div>
    </details>
  );
}

export function ChartFrame({ title, description, summary, legend, csv, fileBase, image = true, className = "", children }: ChartFrameProps) {
  const chart = useRef<HTMLDivElement>(null);
  const base = fileBase ?? fileSlug(title);
  const headingId = `view-${fileSlug(title)}`;
  const summaryId = `${headingId}-summary`;
  return (
    <section aria-labelledby={headingId} data-view={base} className={`rounded-lg border border-stone-200 bg-white p-5 shadow-xs print:border-0 print:p-0 print:shadow-none ${className}`}>
      <div className="mb-2 flex flex-wrap items-start justify-between gap-3">
        <h2 id={headingId} className="text-base font-semibold text-stone-900">{title}</h2>
        <ExportMenu title={title} onCsv={() => downloadCsv(`${base}.csv`, csv)}
          onSvg={image ? () => { if (chart.current) downloadSvg(chart.current, `${base}.svg`); } : null}
          onPng={image ? () => { if (chart.current) void downloadPng(chart.current, `${base}.png`); } : null} />
      </div>
      {description ? <p className="mb-3 max-w-3xl text-sm text-stone-600">{description}</p> : null}
      {image ? (
        <figure aria-labelledby={headingId} aria-describedby={summary ? summaryId : undefined} className="m-0">
          <div ref={chart} className="chart-fit">
            {legend && legend.length > 0 ? <ChartLegend items={legend} /> : null}
            {children}
          </div>
          {summary ? <figcaption id={summaryId} className="mt-2 max-w-3xl text-sm text-stone-700" data-testid="chart-summary">{summary}</figcaption> : null}
        </figure>
      ) : (
        <div ref={chart}>{children}</div>
      )}
    </section>
  );
}
