// The compound registry and search in the browser: register from SMILES (a bad line stops the batch and is named),
// see the depiction and estimated sites, find similar compounds and the workups that used them; another group sees
// none of it.
import { expect, test, type Page } from "@playwright/test";
import { alert, signIn, signOut } from "./helpers";
import { PEOPLE } from "./people";

const LIDOCAINE = "CCN(CC)CC(=O)Nc1c(C)cccc1C";

async function registerSmiles(page: Page, text: string) {
  await page.goto("/compounds/new");
  await page.getByLabel("SMILES, one structure per line").fill(text);
  await page.getByRole("button", { name: "Register", exact: true }).click();
}

/** The image finished loading and is not a broken-image placeholder. */
async function expectDrawn(page: Page, alt: string) {
  const image = page.getByAltText(alt).first();
  await expect(image).toBeVisible();
  await expect.poll(() => image.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
}

/** A workup that used the compound, with an outcome, through the JSON API (same session as the page). */
async function recordWorkupUsing(page: Page, compoundId: string, title: string) {
  // The spec of examples/amine-back-extraction.json, reduced to the product.
  const spec = {
    components: [{
      key: "lidocaine", name: "lidocaine", role: "product", smiles: LIDOCAINE, molarMass: 234.34, amount: { value: 4, unit: "mmol" },
      logP: { value: 2.44, provenance: "literature", source: "PhysProp experimental log Kow" },
      pKas: [{ value: 7.9, kind: "base", provenance: "literature", source: "Bekhit, 'Lidocaine for neural blockade', Cambridge University Press" }],
    }],
    mixture: { solvents: [{ solvent: "toluene", volume: { value: 25, unit: "mL" } }] },
    operations: [
      { type: "back_extract", reagent: "hcl_3m", volume: { value: 10, unit: "mL" }, portions: 2, keep: "aqueous" },
      { type: "adjust_ph", reagent: "naoh_10pct", targetPh: 12.5 },
      { type: "extract", solvent: "hexane", volume: { value: 15, unit: "mL" }, portions: 3, keep: "organic" },
      { type: "dry", agent: "na2so4", mass: { value: 3, unit: "g" } },
      { type: "concentrate" },
    ],
  };
  const created = await page.request.post("/api/v1/workups", {
    data: { header: { title, performedOn: "2026-10-20", notebookRef: "HL-0131" }, spec, links: [{ key: "lidocaine", compoundId }] },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  const outcome = await page.request.post(`/api/v1/workups/${id}/outcome`, { data: { isolatedMassMg: 610, purityPct: 96, purityMethod: "qnmr" } });
  expect(outcome.status(), await outcome.text()).toBe(200);
  return id;
}

test("a chemist registers compounds from SMILES, sees the depiction and estimated sites, and finds similar compounds with their workups", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.getByRole("link", { name: "Compounds" }).first().click();
  await page.getByRole("link", { name: "Register compounds" }).click();

  // One malformed line stops the whole batch and is named by line and name.
  await registerSmiles(page, `${LIDOCAINE} lidocaine\nC1CC(=O broken line\nCc1cccc(C)c1N 2,6-dimethylaniline`);
  await expect(alert(page)).toContainText("Nothing was registered: 1 of 3 records needs attention.");
  await expect(alert(page)).toContainText("Line 2 (broken line):");
  await page.goto("/compounds");
  await expect(page.getByRole("link", { name: "lidocaine" })).toHaveCount(0);

  await registerSmiles(page, `${LIDOCAINE} lidocaine\nCc1cccc(C)c1N 2,6-dimethylaniline\nCC(=O)Nc1ccc(O)cc1 paracetamol`);
  const registered = page.getByRole("list", { name: "Registered compounds" });
  await expect(page.getByText("Registered 3 compounds.")).toBeVisible();
  await expect(registered.getByRole("link")).toHaveText(["lidocaine", "2,6-dimethylaniline", "paracetamol"]);

  // The same structure again, written differently, is a duplicate.
  await registerSmiles(page, "Cc1cccc(C)c1NC(=O)CN(CC)CC lidocaine again");
  await expect(alert(page)).toContainText("Line 1 (lidocaine again): already registered as “lidocaine”");

  await page.goto("/compounds");
  await page.getByRole("link", { name: "lidocaine", exact: true }).click();
  await expect(page.getByRole("heading", { name: "lidocaine", level: 1 })).toBeVisible();
  const compoundId = page.url().split("/").pop()!;
  await expectDrawn(page, "Structure of lidocaine");
  const sites = page.getByTestId("sites");
  await expect(sites.getByText("estimated from structure").first()).toBeVisible();
  // Lidocaine's tertiary amine next to the amide: pKa 7.9 (Bekhit, "Lidocaine for neural blockade", CUP), as cited by the site class.
  await expect(sites.getByRole("row").filter({ hasText: "amine α to an amide or ester" })).toContainText("7.9");
  await expect(page.getByTestId("logp")).toContainText("estimated from structure");

  const title = "Lidocaine free base, bicarbonate wash";
  await recordWorkupUsing(page, compoundId, title);

  await page.getByRole("link", { name: "Find similar compounds" }).click();
  await expect(page).toHaveURL(/\/search\?mode=similarity/);
  await page.getByLabel("Structure (SMILES)").fill("CCN(CC)CC(=O)Nc1c(C)cccc1CC"); // an ethyl homologue, not registered
  await page.getByLabel("Lowest similarity (Tanimoto, 0–1)").fill("0.3");
  await page.getByRole("button", { name: "Search" }).click();
  const hits = page.getByTestId("search-hit");
  await expect(hits.first()).toContainText("lidocaine");
  await expect(hits.first().getByTestId("similarity")).toHaveText(/similarity 0\.\d+/);
  await expect(hits.first().getByRole("link", { name: title })).toBeVisible();
  await expect(hits.first().getByRole("row").filter({ hasText: title })).toContainText(/pp|—/);
  await expectDrawn(page, "Structure of lidocaine");
  await expect(hits.filter({ hasText: "paracetamol" })).toHaveCount(0); // far below 0.3 from a lidocaine analogue
});

test("another group never sees the compounds: not in its search, and their pages answer not-found", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await registerSmiles(page, "CC(=O)c1ccc(O)cc1 piceol");
  await page.getByRole("list", { name: "Registered compounds" }).getByRole("link", { name: "piceol" }).click();
  await expect(page.getByRole("heading", { name: "piceol", level: 1 })).toBeVisible();
  const url = page.url();
  await signOut(page);

  await signIn(page, PEOPLE.memberB);
  const response = await page.goto(url);
  expect(response?.status()).toBe(404);
  await expect(page.getByText("piceol")).toHaveCount(0);
  await page.goto("/search?mode=text&query=piceol");
  await expect(page.getByRole("heading", { name: "0 hits" })).toBeVisible();
  const api = await page.request.get(`/api/v1/compounds/${url.split("/").pop()!}`);
  expect(api.status()).toBe(404);
});

test("a viewer can search but not register", async ({ page }) => {
  await signIn(page, PEOPLE.viewerA);
  await page.goto("/compounds");
  await expect(page.getByRole("link", { name: "Register compounds" })).toHaveCount(0);
  const response = await page.goto("/compounds/new");
  expect(response?.status()).toBe(403);
});
