/**
 * The planner's review: two sessions of the same drill played to the end over the socket
 * protocol (one with a prize shock and a facilitator's note), compared side by side on
 * /replays/compare. The page's figures are checked against numbers recomputed here from each
 * session's export (the stored rounds), not from the summary the page reads; the cohort CSV is
 * read back with papaparse; slide downloads are checked as images (PNG signature and IHDR
 * size, decoded by the browser; SVG parsed as XML) of 1920 x 1080; the printed comparison and
 * debrief are PDFs of a sensible number of pages. Screens at laptop, projector and phone size.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import Papa from "papaparse";
import { exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { expectShown } from "../support/numbers";
import { expectAccessible, ROOM_NAMES, SIZES, startRoom } from "../support/room";
import { RESULTS_DIR } from "../support/server";
import { decodePng, download, parseSvg, pngSize } from "../support/slides";

interface ExportRound {
  round: number;
  seatIndices: number[];
  spends: number[];
  bestResponseSpends: number[];
  equilibriumSpends: (number | null)[];
  regrets: number[];
  nashGap: number;
  scenario: { prize: number };
}
interface Exported {
  session: { id: string; title: string; status: string };
  rounds: ExportRound[];
}

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

/** Per-round and per-seat figures recomputed from an export's stored rounds. */
function reference(x: Exported) {
  const rounds = x.rounds.map((r) => {
    const spend = sum(r.seatIndices.map((s) => r.spends[s]!));
    const eq = sum(r.seatIndices.map((s) => r.equilibriumSpends[s]!));
    return { round: r.round, overspend: spend / eq, gapShare: r.nashGap / r.scenario.prize };
  });
  const seats = [0, 1, 2].map((seat) => {
    const played = x.rounds.filter((r) => r.seatIndices.includes(seat));
    const near = played.filter(
      (r) =>
        Math.abs(r.spends[seat]! - r.bestResponseSpends[seat]!) <=
        0.1 * r.bestResponseSpends[seat]!,
    ).length;
    return { regret: sum(played.map((r) => r.regrets[seat]!)), near: near / played.length };
  });
  return { rounds, seats };
}

/** Pages in a PDF: its page objects (`/Type /Page`, not `/Pages`). */
function pdfPages(pdf: Buffer): number {
  return (pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length;
}

test("compare(two finished sessions) shows overspend, distance from equilibrium, seats, marks; CSV, slides and print are right", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  test.setTimeout(240_000);
  const origin = baseURL!;
  const calm = await startRoom(origin, 3);
  await calm.playRound(1, [30, 25]);
  await calm.playRound(2, [28, 22]);
  await calm.playRound(3, [26, 20]);
  calm.close();
  const shocked = await startRoom(origin, 3);
  await shocked.playRound(1, [12.34, 7.89]);
  await shocked.facilitator.command({ type: "noteRound", round: 1, text: "Quarry Road held back" });
  await shocked.facilitator.command({
    type: "applyShock",
    changes: [{ target: "prize", value: 150 }],
  });
  await shocked.playRound(2, [15.02, 9.41]);
  await shocked.playRound(3, [10.77, 11.63]);
  shocked.close();
  const exports: Exported[] = [];
  for (const room of [calm, shocked]) {
    await expect
      .poll(async () => ((await exportJson(origin, room.created.id)) as Exported).session.status)
      .toBe("ended");
    exports.push((await exportJson(origin, room.created.id)) as Exported);
  }
  const refs = exports.map(reference);

  // This browser holds both facilitator keys once their consoles have been opened.
  for (const room of [calm, shocked]) {
    await page.goto(`/facilitate/${room.created.id}#key=${room.created.facilitatorKey}`);
    await expect(page.locator("main h1").first()).toBeVisible();
  }
  await page.setViewportSize(SIZES.laptop);
  await page.goto("/replays");
  await page.getByTestId("replays-compare-link").click();
  await expect(page.getByRole("heading", { level: 1, name: "Compare sessions" })).toBeVisible();
  await expect(page.getByTestId("compare-hint")).toBeVisible();
  await page.getByTestId(`compare-pick-${calm.created.id}`).check();
  await expect(page.getByTestId("compare-view")).toHaveCount(0);
  await page.getByTestId(`compare-pick-${shocked.created.id}`).check();
  await expect(page.getByTestId("compare-view")).toBeVisible();
  await expect(page.getByTestId("compare-caution")).toContainText("A model, not advice");

  // By round: overspend index and the largest regret as a share of the prize, per session.
  for (const [table, pick, scale] of [
    ["compare-overspend-table", (r: (typeof refs)[0]["rounds"][0]) => r.overspend, 1],
    ["compare-gap-table", (r: (typeof refs)[0]["rounds"][0]) => r.gapShare, 100],
  ] as const) {
    for (const [k, ref] of refs.entries()) {
      for (const [i, r] of ref.rounds.entries()) {
        await expectShown(
          page.getByTestId(table).locator("tbody tr").nth(i).locator(`[data-col="c${k}"]`),
          pick(r),
          `${table} session ${k + 1} round ${r.round}`,
          scale,
        );
      }
    }
  }
  // Seats: total regret (money) and the share of rounds within 10% of the best reply.
  for (const [k, ref] of refs.entries()) {
    const rows = page.getByTestId("compare-seats").locator(`tbody tr[data-session="${k + 1}"]`);
    await expect(rows).toHaveCount(3);
    for (const [seat, s] of ref.seats.entries()) {
      await expectShown(
        rows.nth(seat).locator('[data-col="regret"]'),
        s.regret,
        `regret ${k} ${seat}`,
      );
      await expectShown(
        rows.nth(seat).locator('[data-col="near"]'),
        s.near,
        `near ${k} ${seat}`,
        100,
      );
    }
  }
  // The shock (before round 2 of session 2) and the note (round 1) are marked on both charts.
  for (const chart of ["compare-overspend-chart", "compare-gap-chart"]) {
    const label = await page.getByTestId(chart).getAttribute("aria-label");
    expect(label).toContain("Round 1 (2 note)");
    expect(label).toContain("Round 2 (2 changed)");
    await expect(page.getByTestId(chart).locator(".recharts-reference-line")).toHaveCount(2);
  }
  await expect(page.getByTestId("compare-marks")).toContainText("prize 100 -> 150");
  await expect(page.getByTestId("compare-marks")).toContainText("Quarry Road held back");

  // Cohort CSV: every round and seat of both sessions, the numbers the references give.
  const csv = await download(page, "compare-csv");
  expect(csv.name).toMatch(/^cohort-of-2-sessions-\d{4}-\d{2}-\d{2}\.csv$/);
  const parsed = Papa.parse<Record<string, string>>(csv.bytes.toString("utf8").trim(), {
    header: true,
  });
  expect(parsed.errors).toEqual([]);
  for (const [k, x] of exports.entries()) {
    const mine = parsed.data.filter((r) => r.sessionId === x.session.id);
    const rounds = mine.filter((r) => r.record === "round");
    const seats = mine.filter((r) => r.record === "seat");
    expect(
      rounds.map((r) => Number(r.round)),
      `CSV round rows of session ${k + 1} (${x.session.id}) in ${csv.name}: ${parsed.data.length} rows, sessions ${[...new Set(parsed.data.map((r) => r.sessionId))].join(", ")}`,
    ).toEqual([1, 2, 3]);
    expect(seats).toHaveLength(3);
    rounds.forEach((r, i) => {
      expect(Number(r.overspend)).toBeCloseTo(refs[k]!.rounds[i]!.overspend, 9);
      expect(Number(r.nashGapShare)).toBeCloseTo(refs[k]!.rounds[i]!.gapShare, 9);
    });
    seats.forEach((s, i) => {
      expect(Number(s.totalRegret)).toBeCloseTo(refs[k]!.seats[i]!.regret, 9);
      expect(Number(s.nearBestReply)).toBeCloseTo(refs[k]!.seats[i]!.near, 12);
    });
  }
  const shockedRows = parsed.data.filter((r) => r.sessionId === shocked.created.id);
  expect(shockedRows.find((r) => r.round === "2")!.shock).toBe("prize 100 -> 150");
  expect(shockedRows.find((r) => r.round === "1")!.note).toBe("Quarry Road held back");

  // Slides: PNG and SVG at 1920 x 1080 with title, units and caption.
  const slides = path.join(RESULTS_DIR, "slides");
  mkdirSync(slides, { recursive: true });
  const png = await download(page, "compare-overspend-chart-slide-png");
  expect(png.name).toMatch(/^overspend-index-by-round-slide\.png$/);
  expect(pngSize(png.bytes)).toEqual({ width: 1920, height: 1080 });
  const decoded = await decodePng(page, png.bytes);
  expect(decoded).toMatchObject({ width: 1920, height: 1080 });
  expect(decoded.ink, "the PNG has a drawing on it").toBeGreaterThan(0.01);
  writeFileSync(path.join(slides, "compare-overspend.png"), png.bytes);
  const svg = await download(page, "compare-gap-chart-slide-svg");
  writeFileSync(path.join(slides, "compare-gap.svg"), svg.bytes);
  const svgDoc = await parseSvg(page, svg.bytes.toString("utf8"));
  expect(svgDoc).toMatchObject({ error: null, tag: "svg", width: "1920", height: "1080" });
  expect(svgDoc.text).toContain("Distance from equilibrium by round");
  expect(svgDoc.text.join(" ")).toContain("Largest regret (% of the prize)");
  expect(svgDoc.text.join(" ")).toContain("converged");
  expect(svgDoc.text.join(" ")).toContain("2 changed");
  // the slide stands alone: its legend names each session in full
  expect(svgDoc.text.join(" ")).toContain(`1. ${exports[0]!.session.title}`);
  expect(svgDoc.lines, "one line per session").toBe(2);

  await expectAccessible(page, "compare view");
  for (const s of ["laptop", "projector", "phone"] as const) {
    await page.setViewportSize(SIZES[s]);
    await saveScreen(page, `compare-${SIZES[s].width}x${SIZES[s].height}`);
  }

  // Print: the comparison and a debrief as PDFs with a sensible number of pages.
  const print = path.join(RESULTS_DIR, "print");
  mkdirSync(print, { recursive: true });
  await page.setViewportSize(SIZES.laptop);
  await page.emulateMedia({ media: "print" });
  const margin = { top: "15mm", bottom: "15mm", left: "15mm", right: "15mm" };
  const comparePdf = await page.pdf({ format: "A4", margin, printBackground: true });
  expect(comparePdf.subarray(0, 5).toString()).toBe("%PDF-");
  expect(pdfPages(comparePdf)).toBeGreaterThanOrEqual(1);
  expect(pdfPages(comparePdf)).toBeLessThanOrEqual(6);
  writeFileSync(path.join(print, "compare-A4.pdf"), comparePdf);
  await page.emulateMedia({ media: "screen" });
  await page.goto(`/replays/${shocked.created.id}#key=${shocked.created.facilitatorKey}`);
  await expect(page.locator(".debrief .chart").first()).toBeVisible();
  const debriefPng = await download(page, "replay-history-effort-chart-slide-png");
  expect(pngSize(debriefPng.bytes)).toEqual({ width: 1920, height: 1080 });
  writeFileSync(path.join(slides, "debrief-spends.png"), debriefPng.bytes);
  const roundSvg = await download(page, "replay-round-chart-slide-svg");
  writeFileSync(path.join(slides, "replay-round.svg"), roundSvg.bytes);
  const roundDoc = await parseSvg(page, roundSvg.bytes.toString("utf8"));
  expect(roundDoc).toMatchObject({ error: null, tag: "svg", width: "1920", height: "1080" });
  expect(roundDoc.text).toContain("Round 3: spends against equilibrium");
  expect(roundDoc.text.join(" ")).toContain(ROOM_NAMES[1]!);
  await page.emulateMedia({ media: "print" });
  const debriefPdf = await page.pdf({ format: "A4", margin, printBackground: true });
  expect(pdfPages(debriefPdf)).toBeGreaterThanOrEqual(1);
  expect(pdfPages(debriefPdf)).toBeLessThanOrEqual(8);
  writeFileSync(path.join(print, "debrief-shocked-A4.pdf"), debriefPdf);
});
