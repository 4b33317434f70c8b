import { expect, test } from "../support/fixtures";

test("server health and every page route answer", async ({ page, request, saveScreen }) => {
  const health = await request.get("/api/health");
  expect(health.ok()).toBe(true);
  expect(await health.json()).toMatchObject({ ok: true, db: "pglite" });

  for (const route of ["/", "/new", "/join", "/explore", "/replays"]) {
    const res = await page.goto(route);
    expect(res?.status(), route).toBe(200);
    await expect(page.locator("h1").first()).toBeVisible();
  }
  await page.goto("/");
  await saveScreen(page, "home");
});
