// Two people edit the same saved workup at once. The second save is refused as stale; loading the first person's
// version merges it into the form: the changes each made elsewhere are both kept, the one place both changed is
// offered with both values, and whichever is chosen is what the next save stores. Nothing typed is lost.
import { expect, test, type Page } from "@playwright/test";
import { signIn, typeComponent } from "./helpers";
import { PEOPLE } from "./people";

async function addStep(page: Page, type: string): Promise<void> {
  await page.getByLabel("Add a step").selectOption(type);
  await page.getByLabel("Add a step").press("Enter");
}

const volumeOf = (page: Page, step: number) => page.getByTestId("step-card").nth(step).getByRole("textbox", { name: "Volume per portion" });

test("the merge panel keeps both people's changes and offers both values where they changed the same field", async ({ page, browser }) => {
  const title = `Anisole washes for the merge check ${Date.now()}`;
  await signIn(page, PEOPLE.memberA);
  await page.goto("/workups/new");
  await page.getByLabel("Title").fill(title);
  // Anisole, log P 2.11 (Hansch, Leo & Hoekman 1995; from memory), 108.14 g/mol.
  await typeComponent(page, { name: "Anisole", amountMmol: "2", molarMass: "108.14", logP: "2.11" });
  await addStep(page, "wash");
  await addStep(page, "dry");
  await expect(page.getByTestId("prediction-status")).toContainText("Updated");
  await page.getByRole("button", { name: "Save workup" }).click();
  await expect(page.getByRole("heading", { name: title, level: 1 })).toBeVisible();
  const detailUrl = page.url();

  // Both open version 1.
  const other = await browser.newContext();
  const lead = await other.newPage();
  await signIn(lead, PEOPLE.leadA);
  await lead.goto(`${detailUrl}/edit`);
  await page.goto(`${detailUrl}/edit`);
  await expect(volumeOf(page, 0)).toHaveValue("20");

  // The lead renames it and makes the wash 30 mL, and saves first.
  await lead.getByLabel("Title").fill(`${title} (checked)`);
  await volumeOf(lead, 0).fill("30");
  await lead.getByRole("button", { name: "Save changes" }).click();
  await expect(lead.getByRole("heading", { name: `${title} (checked)`, level: 1 })).toBeVisible();
  await other.close();

  // Meanwhile the member makes the same wash 25 mL, writes the notebook reference and adds a step.
  await volumeOf(page, 0).fill("25");
  await page.getByLabel("Notebook reference").fill("HL-0412");
  await addStep(page, "concentrate");
  await expect(page.getByTestId("step-card")).toHaveCount(3);
  await page.getByRole("button", { name: "Save changes" }).click();

  const conflict = page.getByTestId("save-conflict");
  await expect(conflict).toContainText("Not saved: someone else saved this workup first.");
  await conflict.getByRole("button", { name: "Load their version and merge (keeps my edits)" }).click();
  await expect(conflict).toContainText("is merged into your form");
  await expect(conflict.getByTestId("their-changes")).toContainText("Title");
  await expect(conflict.getByTestId("their-changes")).toContainText("Step 1 (Wash): Volume per portion");
  await expect(conflict.getByTestId("my-changes")).toContainText("Notebook reference");
  await expect(conflict.getByTestId("my-changes")).toContainText("Step 3 (Concentrate)");
  // Operation types and field names in the panel are the editor's words.
  expect(await conflict.innerText()).not.toMatch(/\b(back_extract|adjust_ph|remove_cosolvent|add_salt)\b|\(wash\)|: volume\b/);

  // The one true conflict: both values offered, the form's own standing until a choice is made.
  const both = conflict.getByTestId("merge-conflicts");
  await expect(both).toContainText("Changed by both of you (1)");
  await expect(both).toContainText("Step 1 (Wash): Volume per portion");
  await expect(both.getByRole("radio", { name: "Mine: 25 mL" })).toBeChecked();
  await expect(both.getByRole("radio", { name: "Theirs: 30 mL" })).not.toBeChecked();
  await expect(volumeOf(page, 0)).toHaveValue("25");

  // Their title and my notebook reference and new step are all in the form.
  await expect(page.getByLabel("Title")).toHaveValue(`${title} (checked)`);
  await expect(page.getByLabel("Notebook reference")).toHaveValue("HL-0412");
  await expect(page.getByTestId("step-card")).toHaveCount(3);

  // Taking theirs for the conflict puts 30 mL in the form without touching the rest.
  await both.getByRole("radio", { name: "Theirs: 30 mL" }).check();
  await expect(volumeOf(page, 0)).toHaveValue("30");
  await expect(page.getByLabel("Notebook reference")).toHaveValue("HL-0412");
  await expect(page.getByTestId("step-card")).toHaveCount(3);

  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page.getByRole("heading", { name: `${title} (checked)`, level: 1 })).toBeVisible();
  await expect(page.getByText("HL-0412")).toBeVisible();

  // The stored version has everything: reopened, the editor shows the merged record.
  await page.goto(`${detailUrl}/edit`);
  await expect(volumeOf(page, 0)).toHaveValue("30");
  await expect(page.getByTestId("step-card")).toHaveCount(3);
  await expect(page.getByTestId("step-card").nth(2)).toHaveAttribute("aria-label", "Step 3: Concentrate");
  await expect(page.getByLabel("Notebook reference")).toHaveValue("HL-0412");
});
