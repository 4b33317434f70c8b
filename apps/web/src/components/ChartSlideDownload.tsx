"use client";

import { useRef, useState } from "react";
import type { ReactNode, RefObject } from "react";
import { createPortal } from "react-dom";
import { downloadFileName } from "@contend/protocol";
import { saveBlob } from "../lib/saveFile";
import { SLIDE_HEIGHT, SLIDE_WIDTH, slideSvg } from "../lib/slide";
import type { SlideSeries } from "../lib/slide";

export interface SlideText {
  /** the slide's heading */
  title: string;
  /** one or two sentences under the chart: what it shows, how to read it */
  caption: string;
  /** the slide's legend when it should say more than the chart's (full names in place of numbers) */
  legend?: readonly SlideSeries[];
}

/**
 * The size a chart is drawn at, off screen, for a slide: its text then scales by about 1.8 to
 * fill the slide's chart area (12 px ticks read at about 22 px on a 1080-line slide).
 */
const STAGE = { width: 980, height: 400 };
/** A Recharts drawing, or a hand-drawn chart's <svg> marked `data-slide-chart`. */
const CHART_SVG = ".recharts-wrapper > svg.recharts-surface, svg[data-slide-chart]";

const nextFrame = () => new Promise<void>((resolve) => requestAnimationFrame(() => resolve()));

/** Parts of a chart's drawing that only make sense on screen (hover cursor, active dot). */
const SCREEN_ONLY = ".recharts-tooltip-cursor, .recharts-active-dot";

/** The chart's drawing as markup with its size and font size, read from the page. */
function readChart(container: HTMLElement | null) {
  const svg = container?.querySelector<SVGSVGElement>(CHART_SVG);
  if (!svg) return null;
  const box = svg.getBoundingClientRect();
  // A drawing that scales to its box (width="100%") is in its viewBox's units.
  const view = svg.viewBox.baseVal;
  const scaled = !(Number(svg.getAttribute("width")) > 0) && view && view.width > 0;
  const width = scaled ? view.width : Number(svg.getAttribute("width")) || box.width;
  const height = scaled ? view.height : Number(svg.getAttribute("height")) || box.height;
  if (!(width > 0 && height > 0)) return null;
  const clone = svg.cloneNode(true) as SVGSVGElement;
  for (const el of clone.querySelectorAll(SCREEN_ONLY)) el.remove();
  const fontSize = parseFloat(getComputedStyle(svg).fontSize) || 12;
  // A legend on top sits over room the drawing leaves empty; the slide draws its own legend.
  const legend = container?.querySelector<HTMLElement>(".recharts-legend-wrapper");
  const band = legend?.getBoundingClientRect();
  const onTop = band !== undefined && band.top - box.top < box.height / 2;
  // Keep a text line's height of the band: the top tick label reaches into it.
  const top = band && onTop ? band.bottom - box.top - fontSize : 0;
  const bottom = band && !onTop ? box.bottom - band.top - fontSize : 0;
  return {
    inner: clone.innerHTML,
    width,
    height,
    fontSize,
    top: Math.max(0, top),
    bottom: Math.max(0, bottom),
  };
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
  drawForSlide,
  slide,
  units,
  legend,
  testId,
}: {
  chartRef: RefObject<HTMLElement | null>;
  /** the chart drawn again to fill its parent: drawn off screen at slide proportions when given */
  drawForSlide?: () => ReactNode;
  slide: SlideText;
  units: string;
  legend: readonly SlideSeries[];
  testId?: string;
}) {
  const [error, setError] = useState<string | null>(null);
  const [staged, setStaged] = useState(false);
  const stageRef = useRef<HTMLDivElement>(null);

  /** The drawing to use: the staged copy once it has its full width, else the chart on screen. */
  async function drawing() {
    if (!drawForSlide) return readChart(chartRef.current);
    setStaged(true);
    try {
      for (let i = 0; i < 120; i++) {
        await nextFrame();
        const svg = stageRef.current?.querySelector(CHART_SVG);
        if (svg && Number(svg.getAttribute("width")) >= STAGE.width - 1) {
          return readChart(stageRef.current);
        }
      }
      return readChart(chartRef.current);
    } finally {
      setStaged(false);
    }
  }

  async function save(kind: "svg" | "png") {
    setError(null);
    const chart = await drawing();
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
      {staged &&
        drawForSlide &&
        createPortal(
          <div
            ref={stageRef}
            aria-hidden="true"
            style={{ position: "fixed", left: -10_000, top: 0, ...STAGE, background: "#fff" }}
          >
            {drawForSlide()}
          </div>,
          document.body,
        )}
    </div>
  );
}

/**
 * A chart drawn by `draw` (`staged`: the off-screen copy at slide proportions), with its slide
 * buttons under it when `slide` is given. `chartRef` is the on-screen copy's container.
 */
export function ChartWithSlide({
  draw,
  chartRef,
  slide,
  units,
  legend,
  testId,
}: {
  draw: (staged: boolean) => ReactNode;
  chartRef: RefObject<HTMLElement | null>;
  slide: SlideText | undefined;
  units: string;
  legend: readonly SlideSeries[];
  testId?: string;
}) {
  if (!slide) return draw(false);
  return (
    <>
      {draw(false)}
      <ChartSlideDownload
        chartRef={chartRef}
        drawForSlide={() => draw(true)}
        slide={slide}
        units={units}
        legend={slide.legend ?? legend}
        testId={testId}
      />
    </>
  );
}
