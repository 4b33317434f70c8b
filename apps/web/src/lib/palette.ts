/** Series colours, chosen to stay distinct for common colour-vision deficiencies (Okabe & Ito 2002 palette, darkened for white backgrounds: each reaches 4.5:1 on white, since tooltips and legends print names in it). */
export const SERIES_COLOURS = [
  "#0a6b66",
  "#ba5a00",
  "#3a56b0",
  "#b0306a",
  "#5b7a12",
  "#0072b2",
  "#7a4a2a",
  "#6a3d9a",
] as const;

export const EQUILIBRIUM_COLOUR = "#757575";

export function seriesColour(i: number): string {
  return SERIES_COLOURS[i % SERIES_COLOURS.length] as string;
}

/**
 * The big screen's colours (dark room, projector). Every text colour reaches 4.5:1 and every
 * mark colour 3:1 against both panel backgrounds (WCAG 2.1 criteria 1.4.3 and 1.4.11; checked
 * in test/palette.test.ts). Series hues follow Okabe & Ito (2002), lightened for a dark ground.
 */
export const SCREEN = {
  /** page background */
  bg: "#0d131b",
  /** panel background */
  panel: "#151f2b",
  text: "#eef2f6",
  /** secondary text (labels, captions) */
  textSoft: "#b4c2d1",
  /** axis lines and tick labels */
  axis: "#c9d4e0",
  /** grid lines: decoration, not information (no contrast needed) */
  grid: "#2a3848",
  /** sealed / done */
  good: "#6fe0c0",
  /** waiting / attention */
  wait: "#ffd37a",
  /** the equilibrium mark */
  equilibrium: "#c8d0da",
  series: ["#5ed1c6", "#f0a04b", "#8fb4ff", "#f58fbf", "#b5d86a", "#56b4e9", "#e0b48a", "#c3a5f0"],
} as const;

/**
 * A chart's axis lines and tick labels (4.5:1 on white, checked in test/palette.test.ts) and its
 * grid lines (decoration, no contrast needed), on white.
 */
export const PAPER = { axis: "#4a5565", grid: "#e3e7ec" } as const;

/** A chart's axis and grid colours: the big screen's on its dark ground, else on white. */
export function chartInk(dark = false): { axis: string; grid: string } {
  return dark ? { axis: SCREEN.axis, grid: SCREEN.grid } : PAPER;
}

export function screenSeriesColour(i: number): string {
  return SCREEN.series[i % SCREEN.series.length] as string;
}

/** WCAG 2.1 relative luminance of a #rrggbb colour. */
export function relativeLuminance(hex: string): number {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  const [r, g, b] = [m[1], m[2], m[3]].map((h) => {
    const c = parseInt(h as string, 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.1 contrast ratio (lighter + 0.05) / (darker + 0.05), from 1 to 21. */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a);
  const lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}
