// The group's solvent and wash library: a lead records the group's own value with its source, the list marks the
// entry as changed, and it goes back to the shipped value; a member reads the values but gets no editor.
import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";
import { PEOPLE } from "./people";

test("a lead records a measured density with its source, and puts the shipped value back", async ({ page }) => {
  await signIn(page, PEOPLE.leadA);
  await page.getByRole("link", { name: "Solvent and wash library" }).click();
  const row = page.getByRole("row").filter({ has: page.getByRole("link", { name: "Edit Toluene" }) });
  await expect(row.getByText("shipped")).toBeVisible();
  await page.getByRole("link", { name: "Edit Toluene" }).click();

  const density = page.getByRole("group", { name: "Density (g/mL)" });
  await density.getByRole("textbox", { name: "Value" }).fill("862.3");
  await page.getByRole("button", { name: "Save for the group" }).click();
  await expect(density.getByText("density (g/mL) must be between 0.4 and 3")).toBeVisible();

  // 0.8623 g/mL at 25 °C is the shipped CRC value; the group's pycnometer reading differs in the fourth place.
  await density.getByRole("textbox", { name: "Value" }).fill("0.8619");
  await density.getByRole("textbox", { name: "Source" }).fill("Heron Lab notebook HL-0150, pycnometer");
  await density.getByLabel("Confidence").selectOption("confirmed");
  await page.getByRole("button", { name: "Save for the group" }).click();
  await expect(page).toHaveURL(/\/library$/);
  await expect(row.getByText("changed by the group")).toBeVisible();
  await expect(row.getByRole("cell", { name: "0.862" })).toBeVisible();

  await page.getByRole("link", { name: "Edit Toluene" }).click();
  page.once("dialog", (d) => void d.accept());
  await page.getByRole("button", { name: "Back to the shipped values" }).click();
  await expect(page).toHaveURL(/\/library$/);
  await expect(row.getByText("shipped")).toBeVisible();
});

test("a member reads an entry's values and sources but cannot edit or add", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.goto("/library");
  await expect(page.getByText("Only a group lead can change the library.")).toBeVisible();
  await page.getByRole("link", { name: "Details of Dichloromethane" }).click();
  await expect(page.getByRole("heading", { name: "Dichloromethane", level: 1 })).toBeVisible();
  await expect(page.getByRole("button", { name: "Save for the group" })).toHaveCount(0);
  await expect(page.getByRole("region", { name: "Sources" })).toContainText("OSHA");
  const response = await page.goto("/library/solvents/new");
  expect(response?.status()).toBe(403);
});

test("the library's key explains every mark and abbreviated heading in a real table, and each table is named", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.goto("/library");
  const key = page.getByRole("table", { name: "What the marks and abbreviated headings in the tables below mean." });
  await expect(key).toBeVisible();
  await expect(key.getByRole("columnheader")).toHaveText(["Mark or heading", "Reads as", "Meaning"]);
  // Every abbreviated heading of the tables has its row, read out by name.
  for (const term of ["density", "boiling point", "solvent in water", "water in the solvent", "strength", "drying capacity", "hold-up", "entry key"]) {
    await expect(key.getByRole("rowheader", { name: term, exact: true })).toBeVisible();
  }
  await expect(key.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "recalled value" }) })).toContainText("not checked in a source");
  await expect(key.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "changed by the group" }) })).toContainText("group lead replaced");
  // The data tables carry their own names, and the headings spell their symbols out.
  const solvents = page.getByRole("table", { name: /^Solvents:/ });
  await expect(solvents.getByRole("columnheader", { name: /ρ/ }).locator("abbr")).toHaveAttribute("title", "density");
  await expect(page.getByRole("table", { name: /^Aqueous reagents and salts:/ })).toBeVisible();
  await expect(page.getByRole("table", { name: /^Drying agents:/ })).toBeVisible();
});
