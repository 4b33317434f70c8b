/**
 * Library journeys: past sessions are renamed, tagged, searched, archived and deleted on
 * /replays (each change cross-checked against the server); a scenario is saved from the
 * editor, saved again as a second version with new numbers, and a session is started from
 * version 1 on /scenarios, which plays version 1's numbers; a saved scenario is renamed inline
 * from the keyboard (the name rule's message at the field, Escape cancels) without a reload.
 * Screens at three sizes.
 */
import type { Page } from "@playwright/test";
import { createSession, E2E_OPERATOR_KEY, exportJson } from "../support/api";
import { expect, test } from "../support/fixtures";
import { expectAccessible, roomScenario, SIZES } from "../support/room";

/** The browser holds these facilitator keys, as if their consoles had been opened here. */
async function holdKeys(page: Page, held: { id: string; key: string }[]) {
  await page.goto("/");
  await page.evaluate(
    (h) => localStorage.setItem("contend.facilitatorKeys", JSON.stringify(h)),
    held,
  );
}

async function titleOnServer(origin: string, id: string): Promise<string> {
  return ((await exportJson(origin, id)) as { session: { title: string } }).session.title;
}

async function screens(
  page: Page,
  saveScreen: (p: Page, n: string) => Promise<void>,
  name: string,
) {
  for (const size of Object.values(SIZES)) {
    await page.setViewportSize(size);
    await saveScreen(page, `${name}-${size.width}x${size.height}`);
  }
  await page.setViewportSize(SIZES.laptop);
}

test("sessions library: rename, tag, search, archive and delete", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  await page.setViewportSize(SIZES.laptop);
  const harbour = await createSession(origin, {
    ...roomScenario(2),
    title: "Harbour kiosk tender",
  });
  const airport = await createSession(origin, {
    ...roomScenario(2),
    title: "Airport slot auction",
  });
  await holdKeys(page, [
    { id: harbour.id, key: harbour.facilitatorKey },
    { id: airport.id, key: airport.facilitatorKey },
  ]);
  await page.goto("/replays");
  const row = (id: string) => page.getByTestId(`session-row-${id}`);
  await expect(row(harbour.id)).toBeVisible();
  await expect(row(airport.id)).toBeVisible();

  // rename inline
  await page.getByTestId(`session-rename-${harbour.id}`).click();
  await page.getByTestId(`session-title-input-${harbour.id}`).fill("Harbour kiosk, Q3 drill");
  await page.getByTestId(`session-title-input-${harbour.id}`).press("Enter");
  await expect(page.getByTestId(`replay-link-${harbour.id}`)).toHaveText("Harbour kiosk, Q3 drill");
  expect(await titleOnServer(origin, harbour.id)).toBe("Harbour kiosk, Q3 drill");

  // tags: the text rule makes "Q3 " into "q3"
  await page.getByTestId(`session-tag-input-${harbour.id}`).fill("Q3 , board");
  await page.getByTestId(`session-tag-add-${harbour.id}`).click();
  await expect(page.getByTestId(`session-tag-q3-${harbour.id}`)).toBeVisible();
  await expect(page.getByTestId(`session-tag-board-${harbour.id}`)).toBeVisible();
  await page.getByTestId(`session-tag-input-${airport.id}`).fill("bad\u0007tag");
  await page.getByTestId(`session-tag-add-${airport.id}`).click();
  await expect(page.getByTestId(`session-error-${airport.id}`)).toContainText("Tag:");

  // search by title text, then by a tag chip
  await page.getByTestId("library-search").fill("airport");
  await expect(row(harbour.id)).toHaveCount(0);
  await expect(row(airport.id)).toBeVisible();
  await page.getByTestId("library-clear").click();
  await page.getByTestId("library-tag-q3").click();
  await expect(row(airport.id)).toHaveCount(0);
  await expect(row(harbour.id)).toBeVisible();
  await page.getByTestId("library-clear").click();
  await expect(row(airport.id)).toBeVisible();
  await screens(page, saveScreen, "library-sessions");
  await expectAccessible(page, "the library of sessions");

  // archive: hidden by default, shown under "archived only"
  await page.getByTestId(`session-archive-${harbour.id}`).click();
  await expect(row(harbour.id)).toHaveCount(0);
  await page.getByTestId("library-archived").selectOption("only");
  await expect(row(harbour.id)).toBeVisible();
  await expect(row(airport.id)).toHaveCount(0);
  await expect(page.getByTestId(`session-unarchive-${harbour.id}`)).toBeVisible();
  await page.getByTestId("library-archived").selectOption("hide");

  // delete, after a confirmation
  await page.getByTestId(`session-delete-${airport.id}`).click();
  await page.getByTestId(`session-delete-confirm-${airport.id}`).click();
  await expect(row(airport.id)).toHaveCount(0);
  const gone = await fetch(`${origin}/api/sessions/${airport.id}/export`, {
    headers: { authorization: `Bearer ${E2E_OPERATOR_KEY}` },
  });
  expect(gone.status).toBe(404);
});

test("the operator link is read when only the fragment changes", async ({ page, baseURL }) => {
  const s = await createSession(baseURL!, { ...roomScenario(1), title: "Operator-only session" });
  await page.goto("/");
  await page.evaluate(() => localStorage.removeItem("contend.facilitatorKeys"));
  await page.goto("/replays");
  await expect(page.getByTestId("replays-empty")).toBeVisible();
  await page.evaluate((k) => {
    window.location.hash = `operator=${encodeURIComponent(k)}`;
  }, E2E_OPERATOR_KEY);
  await expect(page.getByTestId(`session-row-${s.id}`)).toBeVisible();
  await expect(page.getByText("Listed with the operator key")).toBeVisible();
});

test("saved scenarios: save, save a second version, start a session from version 1", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  await page.setViewportSize(SIZES.laptop);
  await page.goto("/new");
  await page.getByTestId("field-prize").fill("100");
  await page.getByTestId("save-library-name").fill("Kiosk drill");
  await page.getByTestId("save-library-note").fill("Q3 numbers");
  await page.getByTestId("save-library-button").click();
  await expect(page.getByTestId("save-library-outcome")).toContainText("version 1");

  // this quarter's numbers, saved as version 2 of the same scenario
  await page.getByTestId("field-prize").fill("140");
  await expect(page.getByTestId("save-library-target")).toContainText("version 2 of");
  await page.getByTestId("save-library-note").fill("Q4 numbers");
  await page.getByTestId("save-library-button").click();
  await expect(page.getByTestId("save-library-outcome")).toContainText("version 2");
  await expect(page.getByTestId("save-library-target")).toContainText("version 3 of");
  await page.getByTestId("save-library").scrollIntoViewIfNeeded();
  await page.getByTestId("save-library").screenshot({
    path: "test-results/screens/library-save-box-1366x768.png",
  });

  await page.goto("/scenarios");
  const versions = page.locator('[data-testid^="scenario-version-"]');
  await expect(versions).toHaveCount(2);
  await expect(versions.nth(0)).toContainText("Version 2");
  await expect(versions.nth(0)).toContainText("Q4 numbers");
  await expect(versions.nth(1)).toContainText("Q3 numbers");
  await screens(page, saveScreen, "library-scenarios");
  await expectAccessible(page, "the saved scenarios");

  const created = page.waitForResponse(
    (r) => r.url().endsWith("/api/sessions") && r.request().method() === "POST",
  );
  await page.locator('[data-testid^="scenario-start-"][data-testid$="-1"]').click();
  const body = (await (await created).json()) as { id: string };
  await expect(page.getByTestId("created-session")).toBeVisible();
  await expect(page.getByTestId("scenario-started-from")).toContainText("version 1 (Q3 numbers)");
  const exported = (await exportJson(origin, body.id)) as {
    events: { type: string; scenario?: { prize: number } }[];
  };
  expect(exported.events.find((e) => e.type === "session-created")?.scenario?.prize).toBe(100);
  await screens(page, saveScreen, "library-scenario-started");
});

/** A saved scenario's name as the server holds it (read with its library key). */
async function scenarioNameOnServer(origin: string, id: string, key: string): Promise<string> {
  const res = await fetch(`${origin}/api/scenarios/${id}`, {
    headers: { authorization: `Bearer ${key}` },
  });
  expect(res.status).toBe(200);
  return ((await res.json()) as { name: string }).name;
}

test("saved scenarios: rename an entry inline, from the keyboard, without a reload", async ({
  page,
  baseURL,
  saveScreen,
}) => {
  const origin = baseURL!;
  const res = await fetch(`${origin}/api/scenarios`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ name: "Kiosk lease v1", note: "Q3 numbers", scenario: roomScenario(1) }),
  });
  expect(res.status).toBe(201);
  const saved = (await res.json()) as { id: string; key: string };
  await page.setViewportSize(SIZES.laptop);
  await page.goto("/");
  await page.evaluate(
    (h) => localStorage.setItem("contend.scenarioKeys", JSON.stringify(h)),
    [{ id: saved.id, key: saved.key }],
  );
  await page.goto("/scenarios");
  const name = page.getByTestId(`scenario-name-${saved.id}`);
  const rename = page.getByTestId(`scenario-rename-${saved.id}`);
  const input = page.getByTestId(`scenario-name-input-${saved.id}`);
  const fieldError = page.getByTestId(`scenario-name-error-${saved.id}`);
  await expect(name).toHaveText("Kiosk lease v1");
  // a marker that a reload would wipe
  await page.evaluate(() => ((window as unknown as { notReloaded: boolean }).notReloaded = true));

  // keyboard only: open the field, an empty name is refused at the field, Escape cancels
  await rename.focus();
  await page.keyboard.press("Enter");
  await expect(input).toBeFocused();
  await expect(input).toHaveValue("Kiosk lease v1");
  await page.keyboard.press("ControlOrMeta+a");
  await page.keyboard.press("Delete");
  await page.keyboard.press("Enter");
  await expect(fieldError).toHaveText("name: must not be empty");
  await expect(input).toHaveAttribute("aria-invalid", "true");
  await expectAccessible(page, "the rename field with its error");
  await screens(page, saveScreen, "library-scenario-rename-error");
  await page.keyboard.press("Escape");
  await expect(name).toHaveText("Kiosk lease v1");
  await expect(rename).toBeFocused();
  expect(await scenarioNameOnServer(origin, saved.id, saved.key)).toBe("Kiosk lease v1");

  // the rename itself: typed, saved with the Save button, shown at once and kept by the server
  await page.keyboard.press("Enter");
  await input.fill("Kiosk lease, base case");
  await screens(page, saveScreen, "library-scenario-rename-field");
  await page.getByTestId(`scenario-rename-save-${saved.id}`).click();
  await expect(name).toHaveText("Kiosk lease, base case");
  await expect(input).toHaveCount(0);
  await expect(rename).toBeFocused();
  await expect(page.getByTestId(`scenario-version-${saved.id}-1`)).toContainText("Q3 numbers");
  expect(
    await page.evaluate(() => (window as unknown as { notReloaded?: boolean }).notReloaded),
  ).toBe(true);
  expect(await scenarioNameOnServer(origin, saved.id, saved.key)).toBe("Kiosk lease, base case");
  await screens(page, saveScreen, "library-scenario-renamed");
});
