/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
/**
 * The debrief prints on A4 and Letter: charts drawn at screen width fit the paper and do not
 * overlap. Real printing lays the page out again at the paper's width without letting the
 * page's scripts redraw the charts; the test does the same by holding ResizeObserver callbacks
 * while it switches to print media at the printable width, then measures the chart boxes, and
 * also writes both PDFs. Replay downloads carry the session's name and date. Every other main
 * screen passes axe and is saved at the three sizes.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { Page } from "@playwright/test";
import { expect, test } from "../support/fixtures";
import { RESULTS_DIR } from "../support/server";
import { pathOf } from "../support/live";
import { expectAccessible, SIZES, startRoom } from "../support/room";

/** Printable width in CSS px (96 per inch) with 15 mm margins, as the stylesheet's @page sets. */
const PAPER = {
  A4: { format: "A4", width: Math.floor(((210 - 30) / 25.4) * 96) },
  Letter: { format: "Letter", width: Math.floor(((215.9 - 30) / 25.4) * 96) },
} as const;

/** Lets a test hold every ResizeObserver callback, as printing does. */
function holdResizeObservers() {
  const Native = window.ResizeObserver;
  const w = window as unknown as { __holdResize?: boolean };
  window.ResizeObserver = class extends Native {
    constructor(cb: ResizeObserverCallback) {
      super((entries, obs) => {
        if (!w.__holdResize) cb(entries, obs);
      });
    }
  };
}

async function chartBoxes(page: Page) {
  return page.evaluate(() =>
    [...document.querySelectorAll(".debrief .chart")].map((el) => {
      const r = el.getBoundingClientRect();
      const svg = el.querySelector("svg.recharts-surface")?.getBoundingClientRect();
      return {
        left: r.left,
        right: r.right,
        top: r.top,
        bottom: r.bottom,
        svgRight: svg ? svg.right : r.right,
        svgBottom: svg ? svg.bottom : r.bottom,
      };
    }),
  );
}

test("debrief prints on A4 and Letter with every chart inside the paper and none overlapping", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  const room = await startRoom(origin, 3);
  await room.playRound(1, [12.34, 7.89]);
  await room.playRound(2, [15.02, 9.41]);
  await room.playRound(3, [10.77, 11.63]);
  room.close();
  await page.addInitScript(holdResizeObservers);
  await page.setViewportSize(SIZES.laptop);
  await page.goto(`/replays/${room.created.id}#key=${room.created.facilitatorKey}`);
  await expect(page.locator(".debrief .chart").first()).toBeVisible();
  const onScreen = await chartBoxes(page);
  expect(onScreen.length, "the debrief has charts").toBeGreaterThanOrEqual(2);

  const dir = path.join(RESULTS_DIR, "print");
  mkdirSync(dir, { recursive: true });
  for (const paper of Object.values(PAPER)) {
    await page.evaluate(() => {
      (window as unknown as { __holdResize?: boolean }).__holdResize = true;
    });
    await page.emulateMedia({ media: "print" });
    await page.setViewportSize({ width: paper.width, height: 1100 });
    const boxes = await chartBoxes(page);
    for (const [k, b] of boxes.entries()) {
      expect(b.left, `${paper.format} chart ${k} left edge`).toBeGreaterThanOrEqual(-0.5);
      expect(
        Math.max(b.right, b.svgRight),
        `${paper.format} chart ${k} right edge`,
      ).toBeLessThanOrEqual(paper.width + 0.5);
      expect(b.svgBottom, `${paper.format} chart ${k}: drawing inside its box`).toBeLessThanOrEqual(
        b.bottom + 0.5,
      );
    }
    const tableRights = await page.evaluate(() =>
      [...document.querySelectorAll(".debrief table")].map((t) => t.getBoundingClientRect().right),
    );
    expect(tableRights.length, "the debrief has tables").toBeGreaterThan(0);
    for (const [k, right] of tableRights.entries()) {
      expect(right, `${paper.format} table ${k} right edge`).toBeLessThanOrEqual(paper.width + 0.5);
    }
    const legendIcons = await page.evaluate(() =>
      [...document.querySelectorAll(".debrief .recharts-legend-item svg")].map(
        (svg) => svg.getBoundingClientRect().width,
      ),
    );
    for (const w of legendIcons) expect(w, `${paper.format} legend icon width`).toBeLessThan(30);
    for (let a = 0; a < boxes.length; a++) {
      for (let c = a + 1; c < boxes.length; c++) {
        const x = boxes[a]!;
        const y = boxes[c]!;
        const overlapW = Math.min(x.right, y.right) - Math.max(x.left, y.left);
        const overlapH = Math.min(x.bottom, y.bottom) - Math.max(x.top, y.top);
        expect(
          overlapW > 0.5 && overlapH > 0.5,
          `${paper.format} charts ${a} and ${c} overlap`,
        ).toBe(false);
      }
    }
    await saveScreen(page, `debrief-print-${paper.format}`);
    const pdf = await page.pdf({
      format: paper.format,
      margin: { top: "15mm", bottom: "15mm", left: "15mm", right: "15mm" },
      printBackground: true,
    });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    writeFileSync(path.join(dir, `debrief-${paper.format}.pdf`), pdf);
    await page.emulateMedia({ media: "screen" });
    await page.evaluate(() => {
      (window as unknown as { __holdResize?: boolean }).__holdResize = false;
    });
    await page.setViewportSize(SIZES.laptop);
  }

  // Downloads are named after the session and its date.
  const stem = /^library-reprint-order-three-print-shops-\d{4}-\d{2}-\d{2}\./;
  for (const [id, ext] of [
    ["download-json", "json"],
    ["download-csv", "csv"],
  ] as const) {
    const [file] = await Promise.all([page.waitForEvent("download"), page.getByTestId(id).click()]);
    expect(file.suggestedFilename()).toMatch(new RegExp(stem.source + ext + "$"));
  }
  // The first / last buttons draw their icons (SVG), not font glyphs that may be missing.
  await expect(page.getByTestId("replay-first").locator("svg")).toHaveCount(1);
  await expect(page.getByTestId("replay-last").locator("svg")).toHaveCount(1);
  await expect(page.getByTestId("replay-first")).not.toContainText(/\S/);
  await expectAccessible(page, "replay and debrief");
  for (const s of ["laptop", "projector", "phone"] as const) {
    await page.setViewportSize(SIZES[s]);
    await saveScreen(page, `replay-${SIZES[s].width}x${SIZES[s].height}`);
  }
});

test("every other main screen passes axe and is saved at laptop, projector and phone sizes", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  const room = await startRoom(baseURL!, 2);
  await room.playRound(1, [12.34, 7.89]);
  room.close();
  const screens: [string, string][] = [
    ["start", "/"],
    ["new-session", "/new"],
    ["join", "/join"],
    ["explorer", "/explore"],
    ["replays", "/replays"],
    ["seat", pathOf(room.created.seats[0]!.link!)],
  ];
  for (const [name, url] of screens) {
    await page.setViewportSize(SIZES.laptop);
    await page.goto(url);
    await expect(page.locator("main h1").first()).toBeVisible();
    // Checked and saved once settled: the explorer greys its last answer (low contrast on
    // purpose) while the worker solves, which on a loaded machine outlasts the page load.
    await expect(page.locator('[aria-busy="true"]')).toHaveCount(0, { timeout: 30_000 });
    await expectAccessible(page, name);
    for (const s of ["laptop", "projector", "phone"] as const) {
      await page.setViewportSize(SIZES[s]);
      await saveScreen(page, `${name}-${SIZES[s].width}x${SIZES[s].height}`);
    }
  }
});
