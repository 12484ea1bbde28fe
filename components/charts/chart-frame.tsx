"use client";
// One view of a report: a titled section with its own CSV, SVG and PNG export (hidden when printing).
import { useRef, type ReactNode } from "react";
import { type CsvCell, fileSlug } from "./csv";
import { downloadCsv, downloadPng, downloadSvg } from "./export";

const exportButton =
  "rounded-md border border-stone-300 bg-white px-2.5 py-1 text-xs font-medium text-stone-700 hover:bg-stone-50 " +
  "focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-teal-600";

export interface ChartFrameProps {
  title: string;
  /** One sentence on how to read the view. */
  description?: ReactNode;
  /** The view's data, header row first. */
  csv: readonly (readonly CsvCell[])[];
  /** Base of the downloaded files' names. */
  fileBase?: string;
  /** False for a view that is a table only (no image to save). */
  image?: boolean;
  className?: string;
  children: ReactNode;
}

export function ChartFrame({ title, description, csv, fileBase, image = true, className = "", children }: ChartFrameProps) {
  const chart = useRef<HTMLDivElement>(null);
  const base = fileBase ?? fileSlug(title);
  const headingId = `view-${fileSlug(title)}`;
  return (
    <section aria-labelledby={headingId} data-view={base} className={`rounded-lg border border-stone-200 bg-white p-5 shadow-xs print:border-0 print:p-0 print:shadow-none ${className}`}>
      <div className="mb-2 flex flex-wrap items-start justify-between gap-3">
        <h2 id={headingId} className="text-base font-semibold text-stone-900">{title}</h2>
        <div className="flex gap-1.5 print:hidden" role="group" aria-label={`Export ${title}`}>
          <button type="button" className={exportButton} onClick={() => downloadCsv(`${base}.csv`, csv)}>CSV</button>
          {image ? (
            <>
              <button type="button" className={exportButton} onClick={() => chart.current && downloadSvg(chart.current, `${base}.svg`)}>SVG</button>
              <button type="button" className={exportButton} onClick={() => { if (chart.current) void downloadPng(chart.current, `${base}.png`); }}>PNG</button>
            </>
          ) : null}
        </div>
      </div>
      {description ? <p className="mb-3 max-w-3xl text-sm text-stone-600">{description}</p> : null}
      <div ref={chart} className="chart-fit">{children}</div>
    </section>
  );
}
