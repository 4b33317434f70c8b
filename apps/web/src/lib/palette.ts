/** Series colours, chosen to stay distinct for common colour-vision deficiencies (Okabe & Ito 2002 palette, darkened for white backgrounds). */
export const SERIES_COLOURS = [
  "#0a6b66",
  "#c25e00",
  "#3a56b0",
  "#b0306a",
  "#5b7a12",
  "#0072b2",
  "#7a4a2a",
  "#6a3d9a",
] as const;

export const EQUILIBRIUM_COLOUR = "#7a7a7a";

export function seriesColour(i: number): string {
  return SERIES_COLOURS[i % SERIES_COLOURS.length] as string;
}
