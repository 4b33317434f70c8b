"use client";

import { useState } from "react";
import type { RefObject } from "react";
import { downloadFileName } from "@contend/protocol";
import { saveBlob } from "../lib/saveFile";
import { SLIDE_HEIGHT, SLIDE_WIDTH, slideSvg } from "../lib/slide";
import type { SlideSeries } from "../lib/slide";

export interface SlideText {
  /** the slide's heading */
  title: string;
  /** one or two sentences under the chart: what it shows, how to read it */
  caption: string;
}

/** Parts of a chart's drawing that only make sense on screen (hover cursor, active dot). */
const SCREEN_ONLY = ".recharts-tooltip-cursor, .recharts-active-dot";

/** The chart's drawing as markup with its size and font size, read from the page. */
function readChart(container: HTMLElement | null) {
  const svg = container?.querySelector<SVGSVGElement>(".recharts-wrapper > svg.recharts-surface");
  if (!svg) return null;
  const box = svg.getBoundingClientRect();
  const width = Number(svg.getAttribute("width")) || box.width;
  const height = Number(svg.getAttribute("height")) || box.height;
  if (!(width > 0 && height > 0)) return null;
  const clone = svg.cloneNode(true) as SVGSVGElement;
  for (const el of clone.querySelectorAll(SCREEN_ONLY)) el.remove();
  const fontSize = parseFloat(getComputedStyle(svg).fontSize) || 12;
  return { inner: clone.innerHTML, width, height, fontSize };
}

/** Draws the slide's SVG on a slide-sized canvas and returns it as PNG. */
async function rasterise(svg: string): Promise<Blob> {
  const img = new Image();
  img.width = SLIDE_WIDTH;
  img.height = SLIDE_HEIGHT;
  img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;
  await img.decode();
  const canvas = document.createElement("canvas");
  canvas.width = SLIDE_WIDTH;
  canvas.height = SLIDE_HEIGHT;
  const ctx = canvas.getContext("2d");
  if (!ctx) throw new Error("this browser cannot draw on a canvas");
  ctx.drawImage(img, 0, 0, SLIDE_WIDTH, SLIDE_HEIGHT);
  return new Promise((resolve, reject) =>
    canvas.toBlob(
      (b) => (b ? resolve(b) : reject(new Error("this browser made no PNG"))),
      "image/png",
    ),
  );
}

/**
 * "Slide (SVG)" and "Slide (PNG)": the chart at slide size (1920 x 1080) with its title, units,
 * legend and caption, ready for a deck.
 */
export function ChartSlideDownload({
  chartRef,
  slide,
  units,
  legend,
  testId,
}: {
  chartRef: RefObject<HTMLElement | null>;
  slide: SlideText;
  units: string;
  legend: readonly SlideSeries[];
  testId?: string;
}) {
  const [error, setError] = useState<string | null>(null);
  async function save(kind: "svg" | "png") {
    setError(null);
    const chart = readChart(chartRef.current);
    if (!chart) return setError("the chart has not been drawn yet");
    const svg = slideSvg({ ...slide, units, legend, chart });
    const name = downloadFileName(`${slide.title} slide`, kind);
    if (kind === "svg") return saveBlob(new Blob([svg], { type: "image/svg+xml" }), name);
    try {
      saveBlob(await rasterise(svg), name);
    } catch (e) {
      setError(`could not make the PNG: ${(e as Error).message}`);
    }
  }
  return (
    <div className="row no-print small" style={{ gap: "0.5rem", marginTop: "0.25rem" }}>
      <span className="muted">Slide 1920×1080:</span>
      <button
        type="button"
        className="small"
        onClick={() => void save("svg")}
        aria-label={`Download “${slide.title}” as a slide (SVG)`}
        data-testid={testId ? `${testId}-slide-svg` : undefined}
      >
        SVG
      </button>
      <button
        type="button"
        className="small"
        onClick={() => void save("png")}
        aria-label={`Download “${slide.title}” as a slide (PNG)`}
        data-testid={testId ? `${testId}-slide-png` : undefined}
      >
        PNG
      </button>
      {error && (
        <span className="notice error" role="alert">
          {error}
        </span>
      )}
    </div>
  );
}
