/// <reference lib="dom" />
/**
 * Checks of downloaded files, chart slides above all: the download's name and bytes, a PNG's
 * size from its IHDR chunk, the PNG decoded by the browser, an SVG parsed as XML.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { readFile } from "node:fs/promises";
import path from "node:path";
import type { Page } from "@playwright/test";
import { expect } from "./fixtures";
import { RESULTS_DIR } from "./server";

/** Clicks the control with this test id and returns the file it downloads. */
export async function download(page: Page, testId: string) {
  const [file] = await Promise.all([
    page.waitForEvent("download"),
    page.getByTestId(testId).click(),
  ]);
  return { name: file.suggestedFilename(), bytes: await readFile(await file.path()) };
}

/** Width and height from a PNG's IHDR chunk (PNG spec, ISO/IEC 15948: signature, then IHDR). */
export function pngSize(bytes: Buffer): { width: number; height: number } {
  expect([...bytes.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
  expect(bytes.subarray(12, 16).toString("latin1")).toBe("IHDR");
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

/** The browser decodes the PNG; share of sampled pixels that are not white (something is drawn). */
export async function decodePng(page: Page, bytes: Buffer) {
  return page.evaluate(async (b64) => {
    const img = new Image();
    img.src = `data:image/png;base64,${b64}`;
    await img.decode();
    const c = document.createElement("canvas");
    c.width = img.naturalWidth;
    c.height = img.naturalHeight;
    const ctx = c.getContext("2d")!;
    ctx.drawImage(img, 0, 0);
    const data = ctx.getImageData(0, 0, c.width, c.height).data;
    let ink = 0;
    let n = 0;
    for (let i = 0; i < data.length; i += 4 * 97) {
      n++;
      if (data[i]! < 200 || data[i + 1]! < 200 || data[i + 2]! < 200) ink++;
    }
    return { width: img.naturalWidth, height: img.naturalHeight, ink: ink / n };
  }, bytes.toString("base64"));
}

/** The SVG parsed as XML in the browser: no parse error, its size, and its text. */
export async function parseSvg(page: Page, text: string) {
  return page.evaluate((src) => {
    const doc = new DOMParser().parseFromString(src, "image/svg+xml");
    const root = doc.documentElement;
    return {
      error: doc.querySelector("parsererror")?.textContent ?? null,
      tag: root.tagName,
      width: root.getAttribute("width"),
      height: root.getAttribute("height"),
      text: [...doc.querySelectorAll("text")].map((t) => t.textContent ?? ""),
      lines: doc.querySelectorAll("path.recharts-curve").length,
    };
  }, text);
}

/**
 * Downloads a chart's PNG slide (the control with this test id), checks it is 1920 x 1080 with
 * a drawing on it, and keeps it as test-results/slides/<file> for looking at.
 */
export async function expectPngSlide(page: Page, testId: string, file: string): Promise<void> {
  const png = await download(page, testId);
  expect(pngSize(png.bytes)).toEqual({ width: 1920, height: 1080 });
  expect((await decodePng(page, png.bytes)).ink, "the PNG has a drawing on it").toBeGreaterThan(
    0.01,
  );
  mkdirSync(path.join(RESULTS_DIR, "slides"), { recursive: true });
  writeFileSync(path.join(RESULTS_DIR, "slides", file), png.bytes);
}

/**
 * Downloads a chart's SVG slide, checks it parses as a 1920 x 1080 SVG, and returns its source
 * and the parsed document (its text above all).
 */
export async function expectSvgSlide(page: Page, testId: string) {
  const svg = (await download(page, testId)).bytes.toString("utf8");
  const doc = await parseSvg(page, svg);
  expect(doc).toMatchObject({ error: null, tag: "svg", width: "1920", height: "1080" });
  return { svg, doc };
}
