import { expect, test } from "@playwright/test";
import { fixtures, signIn } from "./helpers";
import { PEOPLE, WORKUP_A_TITLE, WORKUP_B_TITLE } from "./people";

test("a viewer reads a workup but cannot reach its edit page", async ({ page }) => {
  await signIn(page, PEOPLE.viewerA);
  await page.goto(`/workups/${fixtures().workupA}`);
  await expect(page.getByRole("heading", { name: WORKUP_A_TITLE, level: 1 })).toBeVisible();
  await expect(page.getByRole("link", { name: "Edit" })).toHaveCount(0);

  const response = await page.goto(`/workups/${fixtures().workupA}/edit`);
  expect(response?.status()).toBe(403);
  await expect(page.getByRole("heading", { name: "Not allowed with your role" })).toBeVisible();
  await expect(page.getByTestId("editor-placeholder")).toHaveCount(0);
});

test("a member of another group gets not-found for this group's workup", async ({ page }) => {
  await signIn(page, PEOPLE.memberB);
  await expect(page.getByRole("link", { name: WORKUP_B_TITLE })).toBeVisible();
  await expect(page.getByText(WORKUP_A_TITLE)).toHaveCount(0);

  for (const url of [`/workups/${fixtures().workupA}`, `/workups/${fixtures().workupA}/edit`]) {
    const response = await page.goto(url);
    expect(response?.status()).toBe(404);
    await expect(page.getByRole("heading", { name: "Nothing here" })).toBeVisible();
    await expect(page.getByText(WORKUP_A_TITLE)).toHaveCount(0);
  }
});

test("the JSON API answers with the same guard: 401 without credentials, 401 for a bad token", async ({ request }) => {
  const anonymous = await request.get("/api/v1/me");
  expect(anonymous.status()).toBe(401);
  expect(await anonymous.json()).toEqual({ error: { code: "unauthenticated", message: "Sign in to continue." } });
  const forged = await request.get("/api/v1/me", { headers: { Authorization: `Bearer lw_${"A".repeat(43)}` } });
  expect(forged.status()).toBe(401);
  expect(await forged.json()).toMatchObject({ error: { code: "unauthenticated" } });
});
