/**
 * Bad input journey: numbers a contest cannot take (negative cost, text, empty) are refused
 * where they are typed, with a visible message, and nothing reaches the server.
 */
import type { Page, Request } from "@playwright/test";
import { expect, test } from "../support/fixtures";

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
  await expectRefused(page, /^Effort step/, "0");
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
