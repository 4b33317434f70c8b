import { describe, expect, it } from "vitest";
import {
  chartInk,
  contrastRatio,
  EQUILIBRIUM_COLOUR,
  PAPER,
  SCREEN,
  SERIES_COLOURS,
} from "../src/lib/palette";

describe("contrast (WCAG 2.1 definitions of relative luminance and contrast ratio)", () => {
  it("matches the definition's end points and a value computed by hand", () => {
    expect(contrastRatio("#000000", "#ffffff")).toBeCloseTo(21, 10);
    expect(contrastRatio("#777777", "#777777")).toBe(1);
    // #767676 on white is the commonly quoted 4.54:1 (common practice, no source)
    expect(contrastRatio("#767676", "#ffffff")).toBeCloseTo(4.54, 2);
  });

  const grounds = [SCREEN.bg, SCREEN.panel];
  it("big-screen text colours reach 4.5:1 on both of its backgrounds", () => {
    for (const ground of grounds) {
      for (const text of [SCREEN.text, SCREEN.textSoft, SCREEN.axis, SCREEN.good, SCREEN.wait]) {
        expect(contrastRatio(text, ground), `${text} on ${ground}`).toBeGreaterThanOrEqual(4.5);
      }
    }
  });

  it("big-screen marks (series, equilibrium) reach 3:1 on both of its backgrounds", () => {
    for (const ground of grounds) {
      for (const mark of [...SCREEN.series, SCREEN.equilibrium]) {
        expect(contrastRatio(mark, ground), `${mark} on ${ground}`).toBeGreaterThanOrEqual(3);
      }
    }
  });

  it("page series colours reach 4.5:1 on white: chart tooltips and legends print names in them", () => {
    for (const text of [...SERIES_COLOURS, EQUILIBRIUM_COLOUR]) {
      expect(contrastRatio(text, "#ffffff"), `${text} on white`).toBeGreaterThanOrEqual(4.5);
    }
  });

  it("chart axis labels on white reach 4.5:1; the dark charts take the big screen's colours", () => {
    expect(contrastRatio(PAPER.axis, "#ffffff")).toBeGreaterThanOrEqual(4.5);
    expect(chartInk()).toEqual(PAPER);
    expect(chartInk(true)).toEqual({ axis: SCREEN.axis, grid: SCREEN.grid });
  });
});
