import { expect, test } from "@playwright/test";
import { alert, fixtures, signIn, signOut } from "./helpers";
import { GROUP_A, PEOPLE, WORKUP_A_TITLE, WORKUP_B_TITLE } from "./people";

test("a member signs in, sees the group's workups, opens one and signs out", async ({ page }) => {
  await page.goto("/workups");
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Fworkups$/);

  await signIn(page, PEOPLE.memberA);
  await expect(page.getByTestId("group-name")).toHaveText(GROUP_A.name);
  await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link")).toHaveText(["Workups", "Compounds", "Search", "Review", "Partition data", "Library", "Members"]);
  await expect(page.getByRole("link", { name: WORKUP_A_TITLE })).toBeVisible();
  await expect(page.getByText(WORKUP_B_TITLE)).toHaveCount(0);

  await page.getByRole("link", { name: WORKUP_A_TITLE }).click();
  await expect(page).toHaveURL(new RegExp(`/workups/${fixtures().workupA}$`));
  await expect(page.getByRole("heading", { name: WORKUP_A_TITLE, level: 1 })).toBeVisible();
  await expect(page.getByText("HL-0112")).toBeVisible();
  await expect(page.getByText("ethyl 4-nitrobenzoate")).toBeVisible();
  const steps = page.getByRole("region", { name: "Steps" }).getByRole("listitem");
  await expect(steps).toHaveCount(3);
  await expect(steps.first()).toContainText("wash");
  await expect(page.getByRole("link", { name: "Edit" })).toBeVisible();

  await signOut(page);
  await page.goto(`/workups/${fixtures().workupA}`);
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=/);
  await expect(page.getByText(WORKUP_A_TITLE)).toHaveCount(0);
});

test("a wrong password is refused with a clear message, and repeated failures are rate-limited", async ({ page }) => {
  await page.goto("/sign-in");
  for (let i = 0; i < 5; i++) {
    await page.getByLabel("Email").fill(PEOPLE.lockout.email);
    await page.getByLabel("Password").fill(`not-the-password-${i}`);
    await page.getByRole("button", { name: "Sign in", exact: true }).click();
    await expect(alert(page)).toHaveText("That email and password do not match an account.");
  }
  await page.getByLabel("Password").fill("e2e-partition-coeff-9");
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(alert(page)).toHaveText(/^Too many failed sign-ins for this email\. Try again in \d+ (seconds|minutes)\.$/);
  await expect(page).toHaveURL(/\/sign-in/);
});
