import fs from "node:fs";
import { expect, type Page } from "@playwright/test";
import { PASSWORD, type E2eFixtures, type Person } from "./people";

export function fixtures(): E2eFixtures {
  return JSON.parse(fs.readFileSync(`${process.env["LW_E2E_DATA_DIR"]}.json`, "utf8")) as E2eFixtures;
}

/** Signs in through the sign-in form (and so through next-auth's credentials endpoint). */
export async function signIn(page: Page, person: Person, password = PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("Email").fill(person.email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page).toHaveURL(/\/workups$/);
  await expect(page.getByRole("heading", { name: "Workups", level: 1 })).toBeVisible();
}

export async function signOut(page: Page): Promise<void> {
  await page.getByTestId("user-menu").click();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/sign-in/);
}

/** Our own alerts (Next.js keeps an empty role="alert" route announcer on every page). */
export function alert(page: Page) {
  return page.getByRole("alert").filter({ hasText: /\S/ });
}

/** A component typed in by hand (no registry), enough for the engine to predict. */
export async function typeComponent(page: Page, values: { name: string; amountMmol: string; molarMass: string; logP: string }): Promise<void> {
  await page.getByRole("button", { name: "Type one in by hand" }).click();
  const card = page.getByTestId("component-card").last();
  await card.getByRole("textbox", { name: "Name" }).fill(values.name);
  await card.getByRole("textbox", { name: "Amount" }).fill(values.amountMmol);
  await card.getByRole("textbox", { name: "Molar mass (g/mol)" }).fill(values.molarMass);
  await card.getByRole("textbox", { name: /^log P/ }).fill(values.logP);
}
