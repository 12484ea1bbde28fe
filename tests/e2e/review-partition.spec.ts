// The group learning a partition coefficient in a real browser: a layer-assay measurement added on the compound's
// partition page re-predicts its workups in the background with visible progress, and their predictions then name
// the group value as their source.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { signIn } from "./helpers";
import { PEOPLE } from "./people";
import { ACETANILIDE_SMILES, workupWithOutcome } from "./review-data";

interface Detail { prediction: { result: { partition?: { component: string; solvent: string; label: string }[] } } | null }

async function partitionLabel(request: APIRequestContext, workupId: string): Promise<string | undefined> {
  const detail = (await (await request.get(`/api/v1/workups/${workupId}`)).json()) as Detail;
  return detail.prediction?.result.partition?.find((s) => s.component === "acetanilide" && s.solvent === "etoac")?.label;
}

test("a layer assay changes the compound's provenance label and re-predicts its workups with visible progress", async ({ page }) => {
  test.setTimeout(120_000);
  // Another group than the other browser tests' registry and review data (Kestrel Lab), so their counts stay put.
  await signIn(page, PEOPLE.memberB);
  await page.goto("/compounds/new");
  await page.getByLabel("SMILES, one structure per line").fill(`${ACETANILIDE_SMILES} acetanilide`);
  await page.getByRole("button", { name: "Register", exact: true }).click();
  await page.getByRole("list", { name: "Registered compounds" }).getByRole("link", { name: "acetanilide" }).click();
  await expect(page.getByRole("heading", { name: "acetanilide", level: 1 })).toBeVisible();
  const compoundId = new URL(page.url()).pathname.split("/").pop() ?? "";
  // Weight-only outcomes: the engine learns nothing from them by itself, so the measurement is the only group data.
  const workups: string[] = [];
  for (const [i, day] of ["2026-08-03", "2026-08-10", "2026-08-17"].entries()) {
    workups.push(await workupWithOutcome(page.request, { title: `Anilide extraction ${i + 1}`, performedOn: day, solvent: "etoac" }, 0.9, { compoundId, weightOnly: true }));
  }
  expect(await partitionLabel(page.request, workups[0]!)).toBe("from literature log P via the solvent's Collander line");

  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Partition data" }).click();
  await page.getByLabel("Compound", { exact: true }).selectOption({ label: "acetanilide" });
  await page.getByRole("button", { name: "Open" }).click();
  await expect(page.getByRole("heading", { name: "Partition data: acetanilide", level: 1 })).toBeVisible();
  await expect(page.getByText("No observations yet")).toBeVisible();

  const form = page.getByRole("form", { name: "Add a partition measurement" });
  await form.getByLabel("Method", { exact: true }).selectOption({ label: "Layer assay" });
  await form.getByLabel("Amount in the organic layer").fill("3");
  await form.getByLabel("Amount in the aqueous layer").fill("1");
  await form.getByLabel("Organic layer volume (mL)").fill("10");
  await form.getByLabel("Aqueous layer volume (mL)").fill("10");
  await form.getByLabel("Aqueous pH after equilibration").fill("7");
  await form.getByRole("button", { name: "Add measurement" }).click();
  await expect(form.getByRole("status")).toContainText("Saved: log D 0.48, neutral log K");

  // The re-validation shows its progress and reports when it is done.
  const progress = page.getByTestId("job-progress");
  await expect(progress).toContainText("Last re-validation: 3 workups re-predicted", { timeout: 90_000 });
  await expect(page.getByTestId("observation-row")).toHaveCount(1);
  await expect(page.getByRole("region", { name: "Ethyl acetate / water" })).toContainText("group data, n = 1, ±0.25");
  await expect(page.getByRole("region", { name: "Ethyl acetate / water" }).locator(".recharts-wrapper > svg.recharts-surface")).toBeVisible();
  for (const id of workups) expect(await partitionLabel(page.request, id)).toBe("group data, n = 1, ±0.25");

  const [csv] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Export CSV" }).click()]);
  expect(csv.suggestedFilename()).toBe("partition-acetanilide.csv");
});
