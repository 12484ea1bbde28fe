// Refused forms say what to fix in the form's words, in a summary at their top whose links put the focus on the field
// itself (a folded step is unfolded first); what was typed survives; no schema key or enum value reaches the page.
// The notebook entry's address is saved and shown as a link that opens without a referrer or an opener.
import { expect, test, type Page } from "@playwright/test";
import { signIn, typeComponent } from "./helpers";
import { PEOPLE } from "./people";

/** Words of the schemas and the engine that must never reach a reader. */
const INTERNAL_WORDS = /\b(as_expected|weight_only|adjust_ph|back_extract|remove_cosolvent|add_salt|hcl_1m|nh4cl_sat|purityPct|purityMethod|isolatedMassMg|amountMmol|volumeMl|targetPh|layerAssays|notebookUrl|baseVersion|P20\d\d)\b/;

function summaryLink(page: Page, text: string | RegExp) {
  return page.getByTestId("error-summary").getByRole("link", { name: text });
}

test("the editor's summary names each field by label, step and unit, and its links put the focus on the field", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.goto("/workups/new");
  // Anisole, log P 2.11 (Hansch, Leo & Hoekman 1995; from memory), 108.14 g/mol.
  await typeComponent(page, { name: "Anisole", amountMmol: "2", molarMass: "108.14", logP: "2.11" });
  await page.getByLabel("Add a step").selectOption("wash");
  await page.getByLabel("Add a step").press("Enter");
  const step = page.getByTestId("step-card").first();
  await step.getByRole("textbox", { name: "Volume per portion" }).fill("");
  await page.getByLabel("Notebook entry address (URL)").fill("javascript:alert(1)");
  // The step is folded, as at the hood: the summary's link must open it.
  await step.getByRole("button", { name: "Fold step 1" }).click();
  await expect(step.getByRole("textbox", { name: "Volume per portion" })).toHaveCount(0);

  await page.getByRole("button", { name: "Save workup" }).click();
  const summary = page.getByTestId("error-summary");
  await expect(summary).toBeFocused();
  await expect(summary).toContainText("Not saved: 3 problems to fix");
  await expect(summary.getByRole("listitem")).toHaveText([
    "Give the workup a title",
    "Notebook entry address must be a web address starting with http:// or https://",
    "Step 1 (Wash): Volume per portion must be a number (mL)",
  ]);
  expect(await summary.innerText()).not.toMatch(INTERNAL_WORDS);

  await summaryLink(page, /Step 1 \(Wash\)/).click();
  const volume = step.getByRole("textbox", { name: "Volume per portion" });
  await expect(volume).toBeFocused();
  await expect(volume).toHaveAttribute("aria-invalid", "true");

  await summaryLink(page, "Give the workup a title").click();
  await expect(page.getByLabel("Title")).toBeFocused();
  await summaryLink(page, /Notebook entry address/).click();
  const address = page.getByLabel("Notebook entry address (URL)");
  await expect(address).toBeFocused();
  // What was typed is still there, the bad address included, to be corrected rather than retyped.
  await expect(address).toHaveValue("javascript:alert(1)");
  await expect(page.getByTestId("component-card").getByRole("textbox", { name: "Name" })).toHaveValue("Anisole");

  const title = `Anisole brine wash, summary check ${Date.now()}`;
  await page.getByLabel("Title").fill(title);
  await address.fill("https://eln.example.org/entries/AN-0042");
  await volume.fill("20");
  await page.getByRole("button", { name: "Save workup" }).click();
  await expect(page).toHaveURL(/\/workups\/c[0-9a-z]+$/);
  const link = page.getByTestId("notebook-link");
  await expect(link).toHaveAttribute("href", "https://eln.example.org/entries/AN-0042");
  await expect(link).toHaveAttribute("rel", "noopener noreferrer");
  await expect(link).toHaveAttribute("target", "_blank");

  // The outcome form: a purity over 100 % is named with its unit, and the link leads to the purity field.
  await page.getByRole("textbox", { name: "Isolated mass" }).fill("250");
  await page.getByLabel("Purity (mass %)").fill("120");
  await page.getByRole("button", { name: "Report the outcome" }).click();
  const outcomeSummary = page.getByTestId("error-summary");
  await expect(outcomeSummary).toBeFocused();
  await expect(outcomeSummary.getByRole("listitem")).toHaveText(["Purity must be ≤ 100 %"]);
  await outcomeSummary.getByRole("link", { name: "Purity must be ≤ 100 %" }).click();
  await expect(page.getByLabel("Purity (mass %)")).toBeFocused();
  await expect(page.getByRole("textbox", { name: "Isolated mass" })).toHaveValue("250");

  await page.getByLabel("Purity measured by").selectOption("weight_only");
  await page.getByLabel("Purity (mass %)").fill("");
  await page.getByRole("button", { name: "Report the outcome" }).click();
  // The form closes once an outcome exists; its notice stays in the page.
  await expect(page.getByText(/^Saved(: recovery|\.)/)).toBeAttached();
  await page.reload();
  await expect(page.getByRole("heading", { name: title })).toBeVisible();
  expect(await page.locator("main").innerText()).not.toMatch(INTERNAL_WORDS);
});

test("the sign-in form names a blank field in its summary and the link focuses it", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("Email").fill(PEOPLE.memberA.email);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  const summary = page.getByTestId("error-summary");
  await expect(summary).toBeFocused();
  await expect(summary.getByRole("listitem")).toHaveText(["Password: Enter your password."]);
  await summary.getByRole("link", { name: "Password: Enter your password." }).click();
  await expect(page.getByLabel("Password")).toBeFocused();
  await expect(page.getByLabel("Email")).toHaveValue(PEOPLE.memberA.email);
});
