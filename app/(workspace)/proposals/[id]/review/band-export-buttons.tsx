"use client";

import type { RefObject } from "react";
import { CHART } from "@/lib/review/band-plot-layout";
import { bandExportName, type BandExportKind } from "@/lib/review/export-names";
import { standaloneSvg } from "@/lib/review/export-svg";

const BUTTON = "rounded border border-rule bg-card px-2.5 py-1 text-sm hover:bg-paper-deep";
const PNG_SCALE = 2;

function download(blob: Blob, name: string) {
  const url = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/** The chart's markup with the page's palette written in, so the file looks the same outside the app. */
function chartSvg(svg: SVGSVGElement): string {
  const css = getComputedStyle(document.documentElement);
  const palette: Record<string, string> = {};
  for (const name of ["paper", "paper-deep", "card", "ink", "ink-soft", "rule", "copper", "copper-deep", "copper-pale", "slate-line", "teal-line", "violet-dot"]) {
    palette[`--color-${name}`] = css.getPropertyValue(`--color-${name}`).trim();
  }
  return standaloneSvg(svg.outerHTML, { palette, background: palette["--color-card"] || "#ffffff", width: CHART.width, height: CHART.height });
}

function rasterise(markup: string): Promise<Blob> {
  return new Promise((resolve, reject) => {
    const img = new Image();
    const url = URL.createObjectURL(new Blob([markup], { type: "image/svg+xml;charset=utf-8" }));
    img.onload = () => {
      const canvas = document.createElement("canvas");
      canvas.width = CHART.width * PNG_SCALE;
      canvas.height = CHART.height * PNG_SCALE;
      const ctx = canvas.getContext("2d");
      if (!ctx) return reject(new Error("no 2D canvas"));
      ctx.drawImage(img, 0, 0, canvas.width, canvas.height);
      URL.revokeObjectURL(url);
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error("PNG encoding failed"))), "image/png");
    };
    img.onerror = () => reject(new Error("the SVG could not be drawn"));
    img.src = url;
  });
}

/** Export of the current view: SVG and PNG of the chart as drawn, CSV of the numbers behind it. */
export function BandExportButtons({ slug, svgRef, csv, onError }: { slug: string; svgRef: RefObject<SVGSVGElement | null>; csv: () => string; onError: (message: string) => void }) {
  const run = async (kind: BandExportKind) => {
    try {
      const svg = svgRef.current;
      if (kind === "csv") return download(new Blob([csv()], { type: "text/csv;charset=utf-8" }), bandExportName(slug, "csv"));
      if (!svg) return;
      const markup = chartSvg(svg);
      if (kind === "svg") return download(new Blob([markup], { type: "image/svg+xml;charset=utf-8" }), bandExportName(slug, "svg"));
      download(await rasterise(markup), bandExportName(slug, "png"));
    } catch (e) {
      onError(e instanceof Error ? e.message : "export failed");
    }
  };
  return (
    <div role="group" aria-label="Export the current view" className="flex items-center gap-2 text-sm">
      <span className="text-xs font-semibold text-ink-soft">Export</span>
      {(["svg", "png", "csv"] as const).map((kind) => (
        <button key={kind} type="button" className={BUTTON} onClick={() => void run(kind)}>
          {kind.toUpperCase()}
        </button>
      ))}
    </div>
  );
}
