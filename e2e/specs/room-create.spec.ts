/**
 * One click = one session: "Start session" (start page) and "Create session" (editor) create
 * exactly one session however often they are clicked, and show the result where the
 * facilitator is looking.
 */
import type { Page, Request } from "@playwright/test";
import { expect, test } from "../support/fixtures";
import { SIZES } from "../support/room";

function watchCreates(page: Page): Request[] {
  const posts: Request[] = [];
  page.on("request", (r) => {
    if (r.method() === "POST" && new URL(r.url()).pathname === "/api/sessions") posts.push(r);
  });
  return posts;
}

test("start page: a double click on Start session, then another click, makes one session shown in view", async ({
  page,
}) => {
  await page.setViewportSize(SIZES.laptop);
  const posts = watchCreates(page);
  await page.goto("/");
  const start = page.getByTestId("start-template-kiosk-lease");
  await start.dblclick();
  const created = page.getByTestId("created-session");
  await expect(created).toBeVisible();
  await expect(created.getByRole("heading", { name: /Session created/ })).toBeInViewport();
  await expect(start).toBeDisabled();
  await expect(start).toHaveText("Session created");
  await start.click({ force: true });
  await page.mouse.click(10, 10);
  await expect(page.getByTestId("join-code")).toBeVisible();
  expect(posts).toHaveLength(1);
  // The computer seat says how it plays.
  await expect(page.getByTestId("seat-computer-2")).toContainText("Textbook strategist");
});

test("editor: a double click on Create session, then another click, makes one session shown in view", async ({
  page,
}) => {
  await page.setViewportSize(SIZES.laptop);
  const posts = watchCreates(page);
  await page.goto("/new?template=kiosk-lease");
  const create = page.getByTestId("create-session");
  await expect(page.getByTestId("error-count")).toHaveText("Ready.");
  await create.dblclick();
  const created = page.getByTestId("created-session");
  await expect(created.getByRole("heading", { name: /Session created/ })).toBeInViewport();
  await expect(create).toBeDisabled();
  await create.click({ force: true });
  expect(posts).toHaveLength(1);
  // An edit makes a different session possible again: one more click, one more session.
  await page.getByTestId("field-title").fill("Kiosk lease, second group");
  await expect(create).toHaveText("Create another session");
  await create.click();
  await expect(created.getByRole("heading", { name: /second group/ })).toBeInViewport();
  expect(posts).toHaveLength(2);
});
