// Procedure text in a browser: paste the workup part of an experimental section, check what each clause became,
// add the proposed steps, save, copy the paragraph the record writes back, and read it in again to the same steps.
import { expect, test, type Page } from "@playwright/test";
import { signIn, typeComponent } from "./helpers";
import { PEOPLE } from "./people";

const PARAGRAPH = "The mixture was diluted with EtOAc (50 mL), washed with 1 M HCl (2 × 20 mL), sat. aq. NaHCO₃ (20 mL) and brine (20 mL), dried (MgSO₄), filtered and concentrated under reduced pressure. The residue was purified by flash chromatography.";

async function pasteAndRead(page: Page, text: string): Promise<string[]> {
  await page.getByRole("button", { name: "Paste procedure text…" }).click();
  await page.getByLabel(/Workup part of the experimental/).fill(text);
  await page.getByRole("button", { name: "Read text" }).click();
  const steps = page.getByTestId("procedure-steps").getByRole("listitem");
  await expect(steps.first()).toBeVisible();
  return steps.allTextContents();
}

test("a pasted procedure becomes steps, saves, and its written-back paragraph reads in to the same steps", async ({ page, context }) => {
  await context.grantPermissions(["clipboard-read", "clipboard-write"]);
  await signIn(page, PEOPLE.memberA);
  const title = `Pasted procedure ${Date.now()}`;
  await page.goto("/workups/new");
  await expect(page.getByLabel("Add a step")).toBeVisible();
  await page.getByLabel("Title").fill(title);
  // Anisole, log P 2.11 (Hansch, Leo & Hoekman 1995; from memory), 108.14 g/mol.
  await typeComponent(page, { name: "Anisole", amountMmol: "2", molarMass: "108.14", logP: "2.11" });

  const proposed = await pasteAndRead(page, PARAGRAPH);
  expect(proposed).toHaveLength(6);
  // The chromatography is shown as outside the workup, not entered and not hidden.
  await expect(page.getByTestId("procedure-highlight").getByText("The residue was purified by flash chromatography")).toBeVisible();
  await page.getByRole("button", { name: "Add 6 steps to the workup" }).click();
  await expect(page.getByTestId("step-card")).toHaveCount(6);

  await expect(page.getByLabel("Title")).toHaveValue(title);
  await page.getByRole("button", { name: "Save workup" }).click();
  await expect(page).toHaveURL(/\/workups\/(?!new$)[A-Za-z0-9_-]+$/);
  const paragraph = page.getByTestId("procedure-paragraph");
  await expect(paragraph).toContainText("washed with 1 M HCl (2 × 20 mL)");
  await page.getByRole("button", { name: "Copy text" }).click();
  await expect(page.getByText("Copied as plain text.")).toBeVisible();
  const copied = await page.evaluate(() => navigator.clipboard.readText());
  expect(copied).toBe(await paragraph.textContent());

  await page.getByRole("link", { name: "Copy as new" }).click();
  await expect(page.getByLabel("Notebook reference")).toHaveValue("");
  const again = await pasteAndRead(page, copied);
  expect(again).toEqual(proposed);
  await expect(page.getByTestId("procedure-unclear")).toHaveCount(0);
});
