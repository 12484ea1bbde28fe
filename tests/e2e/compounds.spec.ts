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

/** A V2000 MOL block written by hand (BIOVIA "CTfile Formats" 2020: counts, atom and bond lines at fixed columns). */
function molBlock(title: string, atoms: [string, number, number][], bonds: [number, number, number][]): string {
  const f = (v: number) => v.toFixed(4).padStart(10);
  const n = (v: number) => String(v).padStart(3);
  return [
    title, "  hand-drawn", "",
    `${n(atoms.length)}${n(bonds.length)}  0  0  0  0  0  0  0  0999 V2000`,
    ...atoms.map(([el, x, y]) => `${f(x)}${f(y)}${f(0)} ${el.padEnd(3)} 0  0  0  0  0  0  0  0  0  0  0  0`),
    ...bonds.map(([a, b, order]) => `${n(a)}${n(b)}${n(order)}  0`),
    "M  END",
  ].join("\n");
}

const ACETIC_ACID = molBlock("acetic acid", [["C", 0, 0], ["C", 1.299, 0.75], ["O", 1.299, 2.25], ["O", 2.598, 0]], [[1, 2, 1], [2, 3, 2], [2, 4, 1]]);
const ETHYLAMINE = (bondTo: number) => molBlock("ethylamine", [["C", 0, 0], ["C", 1.299, 0.75], ["N", 2.598, 0]], [[1, 2, 1], [2, bondTo, 1]]);
const sdf = (...blocks: string[]) => blocks.map((b) => `${b}\n$$$$\n`).join("");

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
  // Cookie-carried writes must say they come from our own pages (the CSRF check), as the app's own fetches do.
  const sameOrigin = { origin: new URL(page.url()).origin };
  const created = await page.request.post("/api/v1/workups", {
    headers: sameOrigin,
    data: { header: { title, performedOn: "2026-10-20", notebookRef: "HL-0131" }, spec, links: [{ key: "lidocaine", compoundId }] },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { id } = (await created.json()) as { id: string };
  const outcome = await page.request.post(`/api/v1/workups/${id}/outcome`, { headers: sameOrigin, data: { isolatedMassMg: 610, purityPct: 96, purityMethod: "qnmr" } });
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

test("a chemist registers an SD file; a bad record is named by its number, title and line, and nothing is saved", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.goto("/compounds/new");
  await page.getByLabel("A MOL or SD file").check();
  const upload = (text: string) => page.getByLabel("MOL or SD file", { exact: true }).setInputFiles({ name: "batch.sdf", mimeType: "chemical/x-mdl-sdfile", buffer: Buffer.from(text) });

  await upload(sdf(ACETIC_ACID, ETHYLAMINE(9)));
  await page.getByRole("button", { name: "Register", exact: true }).click();
  await expect(alert(page)).toContainText("Nothing was registered: 1 of 2 records needs attention.");
  await expect(alert(page)).toContainText(/Record 2 “ethylamine” \(line \d+\): Line \d+: /);

  await upload(sdf(ACETIC_ACID, ETHYLAMINE(3)));
  await page.getByRole("button", { name: "Register", exact: true }).click();
  await expect(page.getByRole("list", { name: "Registered compounds" }).getByRole("link")).toHaveText(["acetic acid", "ethylamine"]);
  await page.getByRole("link", { name: "acetic acid" }).click();
  await expect(page.getByRole("heading", { name: "acetic acid", level: 1 })).toBeVisible();
  await expect(page.getByLabel("Canonical SMILES")).toHaveText("CC(=O)O");
  await expectDrawn(page, "Structure of acetic acid");
  await expect(page.getByTestId("sites").getByRole("row").filter({ hasText: "carboxylic acid" })).toContainText("estimated from structure");
});

test("an SD file over 1 MB is registered through the same checks", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.goto("/compounds/new");
  await page.getByLabel("A MOL or SD file").check();
  // One record carrying a long data item, as exports from instruments and inventories often do.
  const padded = `${molBlock("propanoic acid", [["C", 0, 0], ["C", 1.299, 0.75], ["C", 2.598, 0], ["O", 2.598, -1.5], ["O", 3.897, 0.75]], [[1, 2, 1], [2, 3, 1], [3, 4, 2], [3, 5, 1]])}\n> <NOTES>\n${"batch record ".repeat(100_000)}\n\n$$$$\n`;
  expect(padded.length).toBeGreaterThan(1_100_000);
  await page.getByLabel("MOL or SD file", { exact: true }).setInputFiles({ name: "large.sdf", mimeType: "chemical/x-mdl-sdfile", buffer: Buffer.from(padded) });
  await page.getByRole("button", { name: "Register", exact: true }).click();
  await expect(page.getByRole("list", { name: "Registered compounds" }).getByRole("link")).toHaveText(["propanoic acid"]);
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
