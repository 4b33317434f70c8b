/**
 * Bad input journey: numbers a contest cannot take (negative cost, text, empty) are refused
 * where they are typed, with a visible message, and nothing reaches the server.
 */
import type { Page, Request } from "@playwright/test";
import { expect, test } from "../support/fixtures";
import { pathOf } from "../support/live";
import { connectSession } from "../support/session";

/** Every request the page makes to the session API from now on. */
function watchApi(page: Page): Request[] {
  const seen: Request[] = [];
  page.on("request", (r) => {
    if (new URL(r.url()).pathname.startsWith("/api/sessions")) seen.push(r);
  });
  return seen;
}

async function expectRefused(page: Page, label: string | RegExp, typed: string): Promise<void> {
  const input = page.getByRole("textbox", { name: label, exact: true });
  await input.fill(typed);
  await expect(input, `${String(label)} = ${JSON.stringify(typed)}`).toHaveAttribute(
    "aria-invalid",
    "true",
  );
  const messageId = await input.getAttribute("aria-describedby");
  expect(messageId).toBeTruthy();
  const message = page.locator(`[id="${messageId}"]`);
  await expect(message).toBeVisible();
  await expect(message).not.toHaveText("");
}

test("new-session form(negative cost, text, empty) shows a message per field and sends nothing", async ({
  page,
  saveScreen,
}) => {
  const api = watchApi(page);
  await page.goto("/new");
  await expect(page.getByRole("heading", { name: "New session" })).toBeVisible();
  await expect(page.getByTestId("error-count")).toHaveText("Ready.");

  await expectRefused(page, "Rival 1 cost", "-3");
  await expectRefused(page, "Rival 2 cost", "cheap");
  await expectRefused(page, "Rival 1 value", "-10");
  await page.getByRole("textbox", { name: /^Prize/ }).fill("");
  await expect(page.getByRole("textbox", { name: /^Prize/ })).toHaveAttribute(
    "aria-invalid",
    "true",
  );
  await expect(page.getByTestId("error-count")).toHaveText(
    /^[4-9] fields to fix\.$|^\d{2,} fields to fix\.$/,
  );
  await expect(page.getByTestId("preview-empty")).toBeVisible();

  await page.getByTestId("create-session").click();
  await expect(page.getByTestId("created-session")).toHaveCount(0);
  await saveScreen(page, "new-session-bad-input");

  // Mending one field at a time clears exactly its message.
  await page.getByRole("textbox", { name: "Rival 1 cost", exact: true }).fill("2");
  await expect(
    page.getByRole("textbox", { name: "Rival 1 cost", exact: true }),
  ).not.toHaveAttribute("aria-invalid", "true");
  await expect(page.getByRole("textbox", { name: "Rival 2 cost", exact: true })).toHaveAttribute(
    "aria-invalid",
    "true",
  );
  await page.getByTestId("create-session").click();
  await expect(page.getByTestId("created-session")).toHaveCount(0);

  // Session settings are checked the same way.
  await expectRefused(page, /^Spend step/, "0");
  await expectRefused(page, "Rounds", "2.5");
  await page.getByTestId("create-session").click();

  expect(api.map((r) => `${r.method()} ${r.url()}`)).toEqual([]);
});

test("new-session form(valid after mending) creates exactly one session", async ({ page }) => {
  const api = watchApi(page);
  await page.goto("/new");
  await expectRefused(page, "Rival 1 cost", "");
  await page.getByRole("textbox", { name: "Rival 1 cost", exact: true }).fill("1.5");
  await expect(page.getByTestId("error-count")).toHaveText("Ready.");
  await page.getByTestId("create-session").click();
  await expect(page.getByTestId("created-session")).toBeVisible();
  const posts = api.filter((r) => r.method() === "POST");
  expect(posts).toHaveLength(1);
  expect(posts[0]!.postDataJSON()).toMatchObject({ rivals: [{ cost: 1.5 }, { cost: 1 }] });
});

test("explorer(negative cost, text) refuses the number and shows no equilibrium", async ({
  page,
}) => {
  await page.goto("/explore");
  await expect(page.getByTestId("eq-effort-0")).not.toHaveText("\u2013");
  await expectRefused(page, "Rival 2 cost", "-2");
  await expect(page.getByTestId("eq-empty")).toBeVisible();
  await expectRefused(page, "Rival 2 cost", "two");
  await expect(page.getByTestId("eq-empty")).toBeVisible();
  await page.getByRole("textbox", { name: "Rival 2 cost", exact: true }).fill("2");
  await expect(page.getByTestId("eq-effort-0")).toBeVisible();
  await expect(page.getByTestId("eq-empty")).toHaveCount(0);
});

test("seat effort(negative, off-step, empty) is refused on the page and no move is sent", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  const session = await connectSession(origin, {
    title: "Two florists bid for the market-hall corner",
    prize: 100,
    currency: "$",
    csf: { kind: "ratio", decisiveness: 1 },
    rivals: [
      { name: "Marigold Stall", cost: 1 },
      { name: "Fernside Flowers", cost: 1 },
    ],
    leader: null,
    session: { outcome: "shares", effortStep: 0.5, rounds: 1, clockSeconds: null },
  });
  const { created } = session;
  const fac = session.facilitator;
  const sent: string[] = [];
  page.on("websocket", (ws) => ws.on("framesent", ({ payload }) => sent.push(String(payload))));
  try {
    await page.goto(pathOf(created.seats[0]!.link!));
    await expect(page.getByRole("heading", { level: 1, name: "Marigold Stall" })).toBeVisible();
    await fac.command({ type: "openRound" });
    const input = page.getByTestId("spend-input");
    const seal = page.getByTestId("seal-button");
    await expect(input).toBeEnabled();

    for (const [typed, why] of [
      ["-5", "negative"],
      ["7.3", "not a multiple of the 0.5 step"],
    ] as const) {
      await input.fill(typed);
      await expect(input, why).toHaveAttribute("aria-invalid", "true");
      await expect(page.locator("#spend-error"), why).not.toHaveText("");
      await expect(seal, why).toBeDisabled();
      await input.press("Enter");
      await expect(page.getByTestId("seal-confirm")).toHaveCount(0);
    }
    await saveScreen(page, "seat-bad-effort");
    await input.fill("");
    await expect(seal).toBeDisabled();
    await input.press("Enter");
    await expect(page.getByTestId("seal-confirm")).toHaveCount(0);
    expect(sent.filter((f) => f.includes("sealMove"))).toEqual([]);

    // A good amount then goes through: the watch above could see a move being sent.
    await input.fill("7.5");
    await expect(seal).toBeEnabled();
    await seal.click();
    await page.getByTestId("seal-confirm-button").click();
    await expect(page.getByTestId("seat-sealed-amount")).toHaveText(/7\.5$/);
    expect(sent.filter((f) => f.includes("sealMove"))).toHaveLength(1);
  } finally {
    session.close();
  }
});
