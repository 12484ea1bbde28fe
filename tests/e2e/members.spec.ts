import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";
import { GROUP_A, PEOPLE } from "./people";

test("a lead invites a viewer by link; the newcomer creates an account and joins", async ({ page, browser }) => {
  await signIn(page, PEOPLE.leadA);
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Members" }).click();
  await expect(page.getByTestId("member-row")).toHaveCount(4);
  await page.getByLabel("Role", { exact: true }).selectOption("viewer");
  await page.getByRole("button", { name: "Create invite link" }).click();
  const link = await page.getByLabel("Send this link to the person you are inviting").inputValue();
  expect(link).toMatch(/\/invite\/[A-Za-z0-9_-]{43}$/);

  const newcomer = await browser.newContext();
  const invited = await newcomer.newPage();
  await invited.goto(link);
  await expect(invited.getByRole("heading", { name: `Join ${GROUP_A.name}` })).toBeVisible();
  await invited.getByLabel("Your name").fill("Wren Calloway");
  await invited.getByLabel("Email").fill("wren.calloway@heron.example");
  // Passwords that differ are refused, and the name and email typed so far stay in the form.
  await invited.getByLabel("Password", { exact: true }).fill("layers-settle-slowly");
  await invited.getByLabel("Password again").fill("layers-settle-quickly");
  await invited.getByRole("button", { name: "Create account and join" }).click();
  // The summary at the top takes the focus and its link leads to the field named by its label.
  const summary = invited.getByTestId("error-summary");
  await expect(summary).toBeFocused();
  await summary.getByRole("link", { name: "Password again: The two passwords differ." }).click();
  await expect(invited.getByLabel("Password again")).toBeFocused();
  await expect(invited.getByLabel("Your name")).toHaveValue("Wren Calloway");
  await expect(invited.getByLabel("Email")).toHaveValue("wren.calloway@heron.example");
  await invited.getByLabel("Password", { exact: true }).fill("layers-settle-slowly");
  await invited.getByLabel("Password again").fill("layers-settle-slowly");
  await invited.getByRole("button", { name: "Create account and join" }).click();
  await expect(invited).toHaveURL(/\/workups$/);
  await expect(invited.getByTestId("group-name")).toHaveText(GROUP_A.name);

  // The link worked once.
  await invited.goto(link);
  await expect(invited.getByRole("heading", { name: "This invite cannot be used" })).toBeVisible();
  await newcomer.close();

  await page.reload();
  await expect(page.getByTestId("member-row")).toHaveCount(5);
  await expect(page.getByTestId("member-row").filter({ hasText: "Wren Calloway" }).getByRole("combobox")).toHaveValue("viewer");
});

test("a member sees the member list but no controls to change it", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.goto("/members");
  await expect(page.getByText("Only a lead can change this list.")).toBeVisible();
  await expect(page.getByRole("button", { name: "Create invite link" })).toHaveCount(0);
  await expect(page.getByRole("button", { name: "Save role" })).toHaveCount(0);
});
