/**
 * A chart as a slide: a 1920 x 1080 SVG (16:9, the common slide size; common practice, no
 * source) with the chart's title, its units, a legend, the chart drawing scaled to fit, and a
 * caption. Pure: the chart's drawing comes in as SVG markup with its size; the browser part
 * (reading the drawing, rasterising to PNG) lives in ChartSlideDownload.
 */

export const SLIDE_WIDTH = 1920;
export const SLIDE_HEIGHT = 1080;

const PAD = 72;
const TITLE_SIZE = 52;
const UNITS_SIZE = 30;
const LEGEND_SIZE = 28;
const LEGEND_ROW = 46;
const CAPTION_SIZE = 28;
const CAPTION_LINE = 38;
const FOOT_SIZE = 22;
const FONT = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif";
/** Average glyph width as a share of the font size, for laying out text without a browser. */
const GLYPH = 0.55;

export interface SlideSeries {
  name: string;
  colour: string;
  dashed?: boolean;
}

export interface SlideSpec {
  title: string;
  /** the axes and their units: "Spend (EUR) by round" */
  units: string;
  caption: string;
  legend: readonly SlideSeries[];
  /**
   * The chart's own drawing: the inner markup of its <svg>, the size it was drawn at, and how
   * much of its top or bottom to leave out (the room a chart keeps for its on-screen legend,
   * which the slide draws itself).
   */
  chart: {
    inner: string;
    width: number;
    height: number;
    fontSize: number;
    top?: number;
    bottom?: number;
  };
}

/** Text for an SVG text node or attribute. */
export function escapeXml(text: string): string {
  return text
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;");
}

/** Words wrapped into lines of at most `width` px at `size` (estimated glyph widths). */
export function wrapText(text: string, width: number, size: number): string[] {
  const max = Math.max(10, Math.floor(width / (GLYPH * size)));
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (line && line.length + 1 + word.length > max) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  return lines;
}

/** Where the chart's drawing goes: scaled to fit the box, aspect kept, centred. */
export function fitInto(
  w: number,
  h: number,
  box: { x: number; y: number; width: number; height: number },
): { x: number; y: number; width: number; height: number; scale: number } {
  const scale = Math.min(box.width / w, box.height / h);
  const width = w * scale;
  const height = h * scale;
  return {
    x: box.x + (box.width - width) / 2,
    y: box.y + (box.height - height) / 2,
    width,
    height,
    scale,
  };
}

/** The title's font size (shrunk to fit one line, down to 40 px) and its lines (at most two). */
export function titleLines(title: string, width: number): { size: number; lines: string[] } {
  const fit = Math.floor(width / (GLYPH * Math.max(1, title.length)));
  const size = Math.max(40, Math.min(TITLE_SIZE, fit));
  return { size, lines: wrapText(title, width, size).slice(0, 2) };
}

export function slideSvg(spec: SlideSpec): string {
  const inner = SLIDE_WIDTH - 2 * PAD;
  const parts: string[] = [];
  const title = titleLines(spec.title, inner);
  let y = PAD - title.size * 0.2;
  for (const line of title.lines) {
    y += title.size * 1.2;
    parts.push(
      `<text x="${PAD}" y="${y}" font-size="${title.size}" font-weight="700" fill="#14202c">${escapeXml(line)}</text>`,
    );
  }
  y += UNITS_SIZE + 18;
  parts.push(
    `<text x="${PAD}" y="${y}" font-size="${UNITS_SIZE}" fill="#4a5565">${escapeXml(spec.units)}</text>`,
  );
  // Legend: items left to right, wrapping to a new row when the next would overflow.
  y += 24;
  let x = PAD;
  let rowTop = y;
  for (const s of spec.legend) {
    const w = 56 + GLYPH * LEGEND_SIZE * s.name.length + 40;
    if (x > PAD && x + w > PAD + inner) {
      x = PAD;
      rowTop += LEGEND_ROW;
    }
    const mid = rowTop + LEGEND_ROW / 2;
    parts.push(
      `<line x1="${x}" y1="${mid}" x2="${x + 44}" y2="${mid}" stroke="${escapeXml(s.colour)}" stroke-width="5"${s.dashed ? ' stroke-dasharray="12 8"' : ""}/>`,
      `<text x="${x + 56}" y="${mid + LEGEND_SIZE * 0.35}" font-size="${LEGEND_SIZE}" fill="#14202c">${escapeXml(s.name)}</text>`,
    );
    x += w;
  }
  const legendBottom = spec.legend.length > 0 ? rowTop + LEGEND_ROW : y;
  const caption = wrapText(spec.caption, inner, CAPTION_SIZE).slice(0, 3);
  const footTop = SLIDE_HEIGHT - PAD / 2 - FOOT_SIZE;
  const captionTop = footTop - 12 - caption.length * CAPTION_LINE;
  const box = {
    x: PAD,
    y: legendBottom + 16,
    width: inner,
    height: captionTop - 16 - (legendBottom + 16),
  };
  const top = Math.max(0, Math.min(spec.chart.top ?? 0, spec.chart.height / 2));
  const bottom = Math.max(0, Math.min(spec.chart.bottom ?? 0, spec.chart.height / 2));
  const drawn = spec.chart.height - top - bottom;
  const fit = fitInto(spec.chart.width, drawn, box);
  parts.push(
    `<svg x="${fit.x}" y="${fit.y}" width="${fit.width}" height="${fit.height}" viewBox="0 ${top} ${spec.chart.width} ${drawn}" font-size="${spec.chart.fontSize}">${spec.chart.inner}</svg>`,
  );
  caption.forEach((line, k) => {
    parts.push(
      `<text x="${PAD}" y="${captionTop + (k + 1) * CAPTION_LINE - 10}" font-size="${CAPTION_SIZE}" fill="#26313d">${escapeXml(line)}</text>`,
    );
  });
  parts.push(
    `<text x="${SLIDE_WIDTH - PAD}" y="${SLIDE_HEIGHT - PAD / 2}" font-size="${FOOT_SIZE}" fill="#4a5565" text-anchor="end">A stylised model to aid thinking, not advice.</text>`,
  );
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${SLIDE_WIDTH}" height="${SLIDE_HEIGHT}" viewBox="0 0 ${SLIDE_WIDTH} ${SLIDE_HEIGHT}" font-family="${escapeXml(FONT)}">` +
    `<title>${escapeXml(spec.title)}</title>` +
    `<rect width="100%" height="100%" fill="#ffffff"/>` +
    parts.join("") +
    `</svg>`
  );
}
