/**
 * Private numbers journey (docs/protocol.md R40-R44): the facilitator makes one rival's cost
 * private in the session editor (a range the other seat sees, the true number typed in the
 * table), a bad range is named at its field, and the session is created. The other seat sees its
 * own numbers exactly and only the range, never the truth: not in its text, not in its DOM, not
 * in any WebSocket frame it receives, until the session ends (positive controls: the private
 * seat's own page, the facilitator console, and the same seat and frames after the end). After
 * the reveal the seat reads its best reply under the truth and under its beliefs, each checked
 * against an independent computation; after the end the replay's debrief shows the truth.
 * Screens of the editor, the seat, the console and the replay at 1366x768, 1920x1080 and 390x844 are saved as artifacts.
 */
import type { Page } from "@playwright/test";
import { expect, test } from "../support/fixtures";
import { framesCarrying, recordFrames } from "../support/frames";
import { expectNotShown, expectShownAll, linkValue, sealSpend } from "../support/live";
import { expectShownEquals, parseShown } from "../support/numbers";
import { expectAccessible, screensAtSizes, SIZES } from "../support/room";

const PRIZE = 100;
const TRUE_COST = 2.35; // Ridge Pottery's private cost per unit of effort (invented)
const LOW = 1.5;
const HIGH = 3.5;
const SPEND_A = 20;
const SPEND_B = 30;

/** Viewport screenshots (what a person sees without scrolling) at each size, by name. */
async function shots(page: Page, name: string, scrollTo?: string): Promise<void> {
  await screensAtSizes(page, `private-${name}`, async (file) => {
    if (scrollTo) await page.getByTestId(scrollTo).scrollIntoViewIfNeeded();
    await page.screenshot({ path: file });
  });
  await page.setViewportSize(SIZES.laptop);
}

/**
 * Ratio contest, r = 1 (Tullock 1980): against another's effort y, a rival with value v and cost
 * c earns v x / (x + y) - c x at effort x; the best effort is sqrt(v y / c) - y (spend = c x).
 */
function tullockBestReplySpend(v: number, c: number, y: number): number {
  return c * Math.max(0, Math.sqrt((v * y) / c) - y);
}

/**
 * The best reply under beliefs, computed independently: the spend maximising the payoff
 * averaged over the other's cost uniform on [LOW, HIGH] (composite Simpson's rule, 400 panels),
 * found by golden-section search. The other's effort at cost k is its spend / k.
 */
function beliefReplySpend(v: number, otherSpend: number): number {
  const avg = (x: number) => {
    const n = 400;
    const h = (HIGH - LOW) / n;
    let s = 0;
    for (let i = 0; i <= n; i++) {
      const k = LOW + i * h;
      const f = (v * x) / (x + otherSpend / k);
      s += f * (i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2);
    }
    return (s * h) / 3 / (HIGH - LOW) - x;
  };
  let a = 0;
  let b = v;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 100; i++) {
    const x1 = b - g * (b - a);
    const x2 = a + g * (b - a);
    if (avg(x1) < avg(x2)) a = x1;
    else b = x2;
  }
  return (a + b) / 2;
}

test("a private cost set in the editor: the other seat sees the range, never the truth, until the end", async ({
  browser,
  baseURL,
}) => {
  const origin = baseURL!;
  const editorCtx = await browser.newContext({ baseURL: origin, viewport: SIZES.laptop });
  const editor = await editorCtx.newPage();
  await editor.goto("/new");
  await editor.getByTestId("field-title").fill("Two potteries bid for the museum shop contract");
  await editor.getByTestId("field-prize").fill(String(PRIZE));
  await editor.getByTestId("field-currency").fill("$");
  await editor.getByTestId("rival-0-name").fill("Harbor Kilns");
  await editor.getByTestId("rival-1-name").fill("Ridge Pottery");
  await editor.getByTestId("rival-1-cost").fill(String(TRUE_COST));
  await editor.getByTestId("field-rounds").fill("2");

  // Make Ridge Pottery's cost private; a range with high below low is named at its field.
  await editor.getByTestId("private-1-cost").check();
  await editor.getByLabel("Low of cost of Ridge Pottery").fill(String(LOW));
  await editor.getByLabel("High of cost of Ridge Pottery").fill("1");
  await expect(editor.getByTestId("private-1-cost-error")).toContainText(
    "Private cost range of Ridge Pottery, high",
  );
  await expect(editor.getByTestId("error-count")).not.toHaveText("Ready.");
  await editor.getByLabel("High of cost of Ridge Pottery").fill(String(HIGH));
  await expect(editor.getByTestId("private-1-cost-error")).toHaveCount(0);
  await editor.getByTestId("field-private-truth").getByLabel("The numbers in the table").check();
  await expect(editor.getByTestId("editor-hidden")).toContainText("Ridge Pottery cost");
  await expect(editor.getByTestId("error-count")).toHaveText("Ready.");
  await shots(editor, "editor", "rivals-table");
  await expectAccessible(editor, "editor with a private cost");

  await editor.getByTestId("create-session").click();
  await expect(editor.getByTestId("created-session")).toBeVisible();
  const seatALink = await linkValue(editor.getByTestId("seat-link-0"));
  const seatBLink = await linkValue(editor.getByTestId("seat-link-1"));
  const consoleLink = await linkValue(editor.getByTestId("facilitator-link"));

  // Seat A (Harbor Kilns): every frame it receives is recorded from the start.
  const ctxA = await browser.newContext({ baseURL: origin, viewport: SIZES.laptop });
  const seatA = await ctxA.newPage();
  const framesA = recordFrames(seatA);
  await seatA.goto(seatALink);
  await expect(seatA.getByRole("heading", { level: 1, name: "Harbor Kilns" })).toBeVisible();
  await expect(seatA.getByTestId("private-ranges")).toContainText(
    "Ridge Pottery: cost per unit of effort from $1.5 to $3.5, any value equally likely",
  );

  // Seat B sees its own cost exactly (positive control: the number is on a page).
  const ctxB = await browser.newContext({ baseURL: origin, viewport: SIZES.laptop });
  const seatB = await ctxB.newPage();
  await seatB.goto(seatBLink);
  await expect(seatB.getByTestId("seat-cost")).toContainText(String(TRUE_COST));

  // The facilitator sees the range and the truth.
  const fac = await editorCtx.newPage();
  fac.on("dialog", (d) => void d.accept());
  await fac.goto(consoleLink);
  await expect(fac.getByTestId("console-private-truth")).toContainText(
    `Ridge Pottery: cost per unit of effort from $1.5 to $3.5, any value equally likely; the truth: $${TRUE_COST}`,
  );
  await fac.getByTestId("open-no-clock").check();
  await fac.getByTestId("open-round").click();

  await sealSpend(seatA, SPEND_A);
  await sealSpend(seatB, SPEND_B, true);
  const row = seatA.getByTestId("private-rounds").locator("tbody tr").first();
  await expect(row).toBeVisible();
  const cells = row.locator("td");
  const truthReply = tullockBestReplySpend(PRIZE, 1, SPEND_B / TRUE_COST);
  expectShownEquals(
    (await cells.nth(4).textContent()) ?? "",
    truthReply,
    "best reply under the truth",
  );
  // The seat's belief reply averages over 256 seeded draws (R43), so it is compared with the
  // quadrature optimum within $0.20, less than half the $0.37 gap to the reply under the truth.
  const beliefShown = parseShown((await cells.nth(5).textContent()) ?? "").value;
  const belief = beliefReplySpend(PRIZE, SPEND_B);
  expect(Math.abs(truthReply - belief)).toBeGreaterThan(0.35);
  expect(Math.abs(beliefShown - belief), `belief reply ${beliefShown} vs ${belief}`).toBeLessThan(
    0.2,
  );

  // Never the truth on seat A before the end: text, DOM and every frame it received.
  await expectNotShown(seatA, [TRUE_COST], "seat A after the reveal");
  expect(framesCarrying(framesA, [TRUE_COST]).map((f) => f.raw.slice(0, 200))).toEqual([]);
  await expectShownAll(seatB, [TRUE_COST], "seat B (its own cost)");
  await shots(seatA, "seat", "private-numbers");
  await expectAccessible(seatA, "seat with private numbers");

  // The facilitator compares the round and ends the session.
  await expect(fac.getByTestId("console-private-compare")).toContainText("Harbor Kilns");
  await shots(fac, "console", "console-private");
  // (the pointer off the charts: a chart tooltip left open is checked by the room specs, not here)
  await fac.mouse.move(0, 0);
  await expectAccessible(fac, "console with private numbers");
  const endedAt = Date.now();
  await fac.getByTestId("end-session").click();
  await expect(seatA.getByTestId("seat-ended")).toBeVisible();

  // Positive controls: after the end the same seat page and frames carry the truth.
  await expect(seatA.getByTestId("private-ranges")).toContainText(`the truth: $${TRUE_COST}`);
  await expect(seatA.getByTestId("private-debrief")).toBeVisible();
  await expectShownAll(seatA, [TRUE_COST], "seat A after the end");
  expect(framesCarrying(framesA, [TRUE_COST]).filter((f) => f.at >= endedAt)).not.toEqual([]);
  await shots(seatA, "seat-ended", "private-debrief");

  // The replay's debrief shows the truth, the plans and how each seat played.
  await fac.getByRole("link", { name: "replay and printable debrief" }).click();
  await expect(fac.getByTestId("debrief-private-truth")).toContainText(`the truth: $${TRUE_COST}`);
  await expect(fac.getByTestId("private-debrief").locator("tbody tr")).toHaveCount(2);
  await shots(fac, "replay", "debrief-private");
});
