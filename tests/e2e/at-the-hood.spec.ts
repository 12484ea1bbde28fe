// At the hood: a phone (390 px) and a tablet (768 px). The editor keeps a one-line prediction summary on screen
// that opens the full panel; steps fold to one line; the review page fits the screen's width.
import { expect, test } from "@playwright/test";
import { signIn, typeComponent } from "./helpers";
import { PEOPLE } from "./people";

for (const width of [390, 768]) {
  test.describe(`at ${width} px`, () => {
    test.use({ viewport: { width, height: 844 } });

    test("the prediction summary stays pinned, opens the panel, and steps fold", async ({ page }) => {
      await signIn(page, PEOPLE.memberA);
      await page.goto("/workups/new");
      await page.getByLabel("Title").fill("Hood check");
      // Anisole, log P 2.11 (Hansch, Leo & Hoekman 1995; from memory), 108.14 g/mol.
      await typeComponent(page, { name: "Anisole", amountMmol: "2", molarMass: "108.14", logP: "2.11" });
      await page.getByLabel("Add a step").selectOption("wash");
      await page.getByLabel("Add a step").press("Enter");

      const summary = page.getByTestId("prediction-summary");
      await expect(summary).toContainText(/\d+ %/);
      // Scrolled to the bottom of a long form, the summary is still on screen.
      await page.getByRole("button", { name: /Save workup/ }).scrollIntoViewIfNeeded();
      const box = await summary.boundingBox();
      expect(box?.y ?? -1).toBeGreaterThanOrEqual(0);
      expect(box?.y ?? 1e9).toBeLessThan(80);
      await expect(page.getByTestId("live-prediction")).toBeHidden();
      await summary.getByRole("button").click();
      await expect(page.getByTestId("live-prediction")).toBeVisible();
      await page.getByRole("button", { name: "Close prediction" }).click();
      await expect(page.getByTestId("live-prediction")).toBeHidden();

      await page.getByRole("button", { name: "Fold step 1" }).click();
      await expect(page.getByTestId("step-summary")).toContainText("Wash");
      await expect(page.getByTestId("step-card").getByLabel("Aqueous reagent")).toHaveCount(0);
      await page.getByRole("button", { name: "Unfold step 1" }).click();
      await expect(page.getByTestId("step-card").getByLabel("Aqueous reagent")).toBeVisible();
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
    });

    test("the review page fits the screen", async ({ page }) => {
      await signIn(page, PEOPLE.leadA);
      await page.goto("/review");
      await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
    });
  });
}
