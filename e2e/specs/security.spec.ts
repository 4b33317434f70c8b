/**
 * Private by default, as a browser sees it: security headers on pages, pages that still work
 * under their Content-Security-Policy, keys that never leave the browser in a URL, and a
 * replays list that shows only this browser's own sessions.
 */
import type { Request } from "@playwright/test";
import { createSession } from "../support/api";
import { expect, test } from "../support/fixtures";
import { pathOf } from "../support/live";

const SCENARIO = {
  title: "Two ferry operators bid for the island route",
  prize: 100,
  csf: { kind: "ratio", decisiveness: 1 },
  rivals: [
    { name: "Gullwing Ferries", cost: 1 },
    { name: "Tidewater Lines", cost: 1.2 },
  ],
  leader: null,
  session: { rounds: 2, clockSeconds: null },
};

test("pages carry the security headers and work under their policy; keys stay out of every request URL and Referer", async ({
  page,
  browser,
  baseURL,
}) => {
  const origin = baseURL!;
  const created = await createSession(origin, SCENARIO);
  const keys = [created.facilitatorKey, created.spectatorKey, created.seats[0]!.key!];
  const requests: { url: string; referer: string }[] = [];
  const record = (r: Request) =>
    requests.push({ url: r.url(), referer: r.headers()["referer"] ?? "" });
  const violations: string[] = [];
  page.on("request", record);
  page.on("console", (m) => {
    if (/Content Security Policy|Refused to/.test(m.text())) violations.push(m.text());
  });

  const res = await page.goto(pathOf(created.links.facilitator));
  const headers = res!.headers();
  const csp = headers["content-security-policy"] ?? "";
  expect(csp).toMatch(/frame-ancestors 'none'/);
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(csp).not.toMatch(/unsafe-eval/);
  expect(headers["x-content-type-options"]).toBe("nosniff");
  expect(headers["referrer-policy"]).toBe("no-referrer");
  // the console is live under the policy: it shows the session and its join code
  await expect(page.getByRole("heading", { level: 1, name: SCENARIO.title })).toBeVisible();
  await expect(page.getByText(created.joinCode).first()).toBeVisible();

  // a seat and the big screen too
  const seat = await browser.newPage({ baseURL: origin });
  seat.on("request", record);
  seat.on("console", (m) => {
    if (/Content Security Policy|Refused to/.test(m.text())) violations.push(m.text());
  });
  await seat.goto(pathOf(created.seats[0]!.link!));
  await expect(seat.getByRole("heading", { level: 1, name: "Gullwing Ferries" })).toBeVisible();
  await seat.goto(pathOf(created.links.spectator));
  await expect(seat.getByRole("heading", { level: 1 }).first()).toBeVisible();
  await seat.close();

  expect(violations).toEqual([]);
  expect(requests.length).toBeGreaterThan(3);
  for (const r of requests) {
    for (const key of keys) {
      expect(r.url, "a key in a request URL").not.toContain(key);
      expect(r.referer, "a key in a Referer").not.toContain(key);
    }
  }
});

test("the replays list shows only the sessions this browser facilitated", async ({
  page,
  browser,
  baseURL,
}) => {
  const origin = baseURL!;
  const mine = await createSession(origin, SCENARIO);
  const theirs = await createSession(origin, { ...SCENARIO, title: "Another team's session" });
  await page.goto(pathOf(mine.links.facilitator));
  await expect(page.getByRole("heading", { level: 1, name: SCENARIO.title })).toBeVisible();
  await page.goto("/replays");
  await expect(page.getByTestId(`replay-link-${mine.id}`)).toBeVisible();
  await expect(page.getByTestId(`replay-link-${theirs.id}`)).toHaveCount(0);

  // a browser that facilitated nothing lists nothing
  const stranger = await browser.newContext({ baseURL: origin });
  const other = await stranger.newPage();
  await other.goto("/replays");
  await expect(other.getByTestId("replays-empty")).toBeVisible();
  // and a replay page opened without its key gets nothing
  await other.goto(`/replays/${mine.id}`);
  await expect(other.getByTestId("replay-error")).toBeVisible();
  await stranger.close();
});
