/**
 * slideSvg: a chart drawing framed as a 1920 x 1080 slide (16:9 at full HD, the common slide
 * size; common practice, no source) with title, units, legend and caption.
 */
import { describe, expect, it } from "vitest";
import {
  escapeXml,
  fitInto,
  SLIDE_HEIGHT,
  SLIDE_WIDTH,
  slideSvg,
  titleLines,
  wrapText,
} from "../src/lib/slide";

const chart = {
  inner: '<g class="recharts-layer"><path d="M0 0L10 10" stroke="#0a6b66"/></g>',
  width: 600,
  height: 300,
  fontSize: 12,
};

describe("slideSvg(spec)", () => {
  it("slideSvg is 1920 x 1080 with escaped title, units, legend names and caption", () => {
    const svg = slideSvg({
      title: "Spends <after> the R&D shock",
      units: "Vertical: Spend (EUR) · across: Round",
      caption: "Each rival's spend per round & its equilibrium spend.",
      legend: [
        { name: "Inkwell Press", colour: "#0a6b66" },
        { name: "Inkwell Press (equilibrium)", colour: "#0a6b66", dashed: true },
      ],
      chart,
    });
    const root = /^<svg ([^>]*)>/.exec(svg)![1]!;
    expect(root).toContain(`width="${SLIDE_WIDTH}"`);
    expect(root).toContain(`height="${SLIDE_HEIGHT}"`);
    expect(root).toContain('xmlns="http://www.w3.org/2000/svg"');
    expect(svg).toContain("Spends &lt;after&gt; the R&amp;D shock");
    expect(svg).not.toContain("<after>");
    expect(svg).toContain("Vertical: Spend (EUR) · across: Round");
    expect(svg).toContain(">Inkwell Press (equilibrium)</text>");
    expect(svg).toContain('stroke-dasharray="12 8"');
    expect(svg).toContain("its equilibrium spend.");
    expect(svg).toContain(chart.inner);
    // the chart keeps its aspect ratio and sits inside the slide
    const nested =
      /<svg x="([\d.]+)" y="([\d.]+)" width="([\d.]+)" height="([\d.]+)" viewBox="0 0 600 300"/.exec(
        svg,
      )!;
    const [x, y, w, h] = nested.slice(1).map(Number) as [number, number, number, number];
    expect(w / h).toBeCloseTo(2, 9);
    expect(x).toBeGreaterThanOrEqual(0);
    expect(y).toBeGreaterThan(200);
    expect(x + w).toBeLessThanOrEqual(SLIDE_WIDTH);
    expect(y + h).toBeLessThanOrEqual(SLIDE_HEIGHT - 100);
    expect(svg.endsWith("</svg>")).toBe(true);
  });
});

describe("slideSvg(spec) with a long title and a legend band", () => {
  it("slideSvg shrinks or wraps a long title to the slide's width and leaves the legend band out of the drawing", () => {
    const title = "Library reprint order: three print shops: spends against equilibrium";
    const { size, lines } = titleLines(title, SLIDE_WIDTH - 144);
    expect(size).toBeLessThan(52);
    expect(lines.join(" ")).toBe(title);
    for (const l of lines) expect(0.55 * size * l.length).toBeLessThanOrEqual(SLIDE_WIDTH - 144);
    const svg = slideSvg({
      title,
      units: "u",
      caption: "c",
      legend: [],
      chart: { ...chart, top: 90 },
    });
    expect(svg).toContain('viewBox="0 90 600 210"');
  });
});

describe("fitInto(w, h, box)", () => {
  it("fitInto scales to the tighter side and centres the other", () => {
    const f = fitInto(600, 300, { x: 0, y: 0, width: 1800, height: 600 });
    expect(f).toEqual({ x: 300, y: 0, width: 1200, height: 600, scale: 2 });
  });
});

describe("wrapText(text, width, size)", () => {
  it("wrapText keeps every word, in order, in lines no longer than the width allows", () => {
    const text = "one two three four five six seven eight nine ten eleven twelve";
    const lines = wrapText(text, 200, 20); // 200 / (0.55 x 20) = 18 characters a line
    expect(lines.join(" ")).toBe(text);
    for (const l of lines) expect(l.length).toBeLessThanOrEqual(18);
    expect(lines.length).toBeGreaterThan(1);
  });
  it("escapeXml escapes &, <, > and double quotes (attribute values use double quotes)", () => {
    expect(escapeXml(`<a href="x">&</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&amp;&lt;/a&gt;");
  });
});
