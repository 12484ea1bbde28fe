// The group-meeting review in a real browser: parity points that open their records, date, chemist and solvent
// filters, per-person figures kept in aggregate for members, CSV/SVG/PNG export of a view, and an A4 print layout.
import fs from "node:fs";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { signIn } from "./helpers";
import { PEOPLE, type Person } from "./people";
import { me, workupWithOutcome } from "./review-data";

const TITLES = {
  asExpected: "Review: anilide wash A",
  shortfall: "Review: anilide shortfall",
  dcm: "Review: anilide in DCM",
  lead: "Review: lead's anilide run",
};

async function signedIn(browser: Browser, person: Person): Promise<Page> {
  const page = await (await browser.newContext({ acceptDownloads: true })).newPage();
  await signIn(page, person);
  return page;
}

const points = (page: Page) => page.locator("a.parity-point");
// Other specs share the browser tests' database and add workups of their own (August, October); every view here is
// scoped to September, the month these fixtures were run in.
const SEPTEMBER = "/review?from=2026-09-01&to=2026-09-30";
const section = (page: Page, title: string) => page.getByRole("region", { name: title });

test.describe.serial("review page", () => {
  test.beforeAll(async ({ browser }) => {
    // Dates before the group's other workups, so they do not push those off the first page of the list.
    const member = await signedIn(browser, PEOPLE.memberA);
    const memberId = (await me(member.request)).id;
    await workupWithOutcome(member.request, { title: TITLES.asExpected, performedOn: "2026-09-05", solvent: "etoac", chemistId: memberId, statedLogK: 1.3 }, 1);
    await workupWithOutcome(member.request, { title: TITLES.shortfall, performedOn: "2026-09-12", solvent: "etoac", chemistId: memberId, statedLogK: 1.3 }, 0.6);
    await workupWithOutcome(member.request, { title: TITLES.dcm, performedOn: "2026-09-15", solvent: "dcm", chemistId: memberId, statedLogK: 1.3 }, 0.995);
    await member.context().close();
    const lead = await signedIn(browser, PEOPLE.leadA);
    await workupWithOutcome(lead.request, { title: TITLES.lead, performedOn: "2026-09-20", solvent: "etoac", chemistId: (await me(lead.request)).id, statedLogK: 1.3 }, 1.005);
    await lead.context().close();
  });

  test("a member reviews the workups: points open their records, filters narrow every view, per-person figures stay in aggregate", async ({ page }) => {
    await signIn(page, PEOPLE.memberA);
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Review" }).click();
    await expect(page.getByRole("heading", { name: "Review", level: 1 })).toBeVisible();
    await page.goto(SEPTEMBER);
    await expect(points(page)).toHaveCount(4);
    await expect(page.getByTestId("summary-workups")).toHaveText("4");
    await expect(page.getByTestId("flagged-list").getByRole("link")).toHaveText([TITLES.shortfall]);
    const flagged = page.getByTestId("flagged-list").getByRole("listitem").first();
    await expect(flagged).toContainText(/Reported \d+ % against \d+ % predicted \(-\d+\.\d points\)/);
    await expect(flagged).toContainText("Likely causes:");

    // Per-person statistics: the member's own beside everyone else's, never another chemist's name.
    const byChemist = section(page, "Deviations by chemist");
    await expect(byChemist.getByRole("row")).toHaveCount(3);
    await expect(byChemist.getByRole("cell", { name: "You", exact: true })).toBeVisible();
    await expect(byChemist.getByRole("cell", { name: "Everyone else (too few to judge)" })).toBeVisible();
    await expect(page.getByText(PEOPLE.leadA.name)).toHaveCount(0);
    await expect(page.getByLabel("Chemist", { exact: true }).getByRole("option")).toHaveText(["Everyone (in aggregate)", `Only mine (${PEOPLE.memberA.name})`]);

    // Solvent filter: only the DCM workup is left in every view.
    await page.getByLabel("Solvent system", { exact: true }).selectOption({ label: "Dichloromethane / water" });
    await page.getByRole("button", { name: "Apply" }).click();
    await expect(page).toHaveURL(/solvent=dcm/);
    await expect(points(page)).toHaveCount(1);
    await expect(page.getByTestId("review-selection")).toContainText("in Dichloromethane / water");
    await expect(section(page, "Deviations by solvent system").getByRole("row")).toHaveCount(2);

    // Date range: 10–16 September holds the shortfall and the DCM run.
    await page.goto("/review?from=2026-09-10&to=2026-09-16");
    await expect(points(page)).toHaveCount(2);
    await expect(page.getByLabel("From", { exact: true })).toHaveValue("2026-09-10");

    // Asking for another chemist's workups alone is refused with a notice; the view stays in aggregate.
    await page.goto(`${SEPTEMBER}&chemist=someone-else`);
    await expect(page.getByText("Only a group lead can look at another chemist's workups on their own")).toBeVisible();
    await expect(points(page)).toHaveCount(4);

    // A point is a link to its record.
    await page.goto(`${SEPTEMBER}&solvent=dcm`);
    await points(page).first().click();
    await expect(page.getByRole("heading", { name: TITLES.dcm, level: 1 })).toBeVisible();
  });

  test("a member records the cause the meeting found, from the keyboard; a refusal names the field; the finding shows on the record", async ({ page }) => {
    await signIn(page, PEOPLE.memberA);
    await page.goto(SEPTEMBER);
    const flagged = page.getByTestId("flagged-list").getByRole("listitem").first();
    const cause = flagged.getByLabel("Cause found at review");
    await cause.focus();
    await cause.selectOption({ label: "Something else (say what in the note)" });
    await page.keyboard.press("Tab");
    await page.keyboard.press("Enter");
    // "Something else" without a note is refused in the form's words, with a link to the note.
    const summary = flagged.getByTestId("error-summary");
    await expect(summary).toContainText("Say in the note what the cause was");
    await expect(summary).toBeFocused();
    await summary.getByRole("link").click();
    await expect(flagged.getByLabel(/^Finding note/)).toBeFocused();
    await cause.selectOption({ label: "Fewer extractions than recorded" });
    await flagged.getByLabel(/^Finding note/).fill("second EtOAc portion skipped");
    await flagged.getByRole("button", { name: "Save finding" }).click();
    await expect(flagged.getByRole("status")).toHaveText("Saved.");
    await page.reload();
    await expect(page.getByTestId("flagged-list").getByRole("listitem").first().getByLabel("Cause found at review")).toHaveValue("one_fewer_extraction");
    await page.getByTestId("flagged-list").getByRole("link", { name: TITLES.shortfall }).click();
    await expect(page.getByRole("heading", { name: TITLES.shortfall, level: 1 })).toBeVisible();
    await expect(page.getByLabel("Cause found at review")).toHaveValue("one_fewer_extraction");
    await expect(page.getByLabel(/^Finding note/)).toHaveValue("second EtOAc portion skipped");
  });

  test("the lead sees each chemist by name and can look at one chemist's workups", async ({ page }) => {
    await signIn(page, PEOPLE.leadA);
    await page.goto(SEPTEMBER);
    const byChemist = section(page, "Deviations by chemist");
    await expect(byChemist.getByRole("cell", { name: `${PEOPLE.memberA.name}`, exact: true })).toBeVisible();
    await expect(byChemist.getByRole("cell", { name: `${PEOPLE.leadA.name} (too few to judge)` })).toBeVisible();
    await page.getByLabel("Chemist", { exact: true }).selectOption({ label: PEOPLE.memberA.name });
    await page.getByRole("button", { name: "Apply" }).click();
    await expect(points(page)).toHaveCount(3);
    await expect(page.getByTestId("review-selection")).toContainText(`by ${PEOPLE.memberA.name}`);
  });

  test("each view exports its data and its image, and the page prints on A4 without navigation or controls", async ({ page }) => {
    await signIn(page, PEOPLE.memberA);
    await page.goto(SEPTEMBER);
    const parity = section(page, "Predicted and reported recovery");
    await expect(points(page)).toHaveCount(4);

    // Each chart is a named figure with its summary in words, never an unnamed "application".
    await expect(page.locator("[role=application]")).toHaveCount(0);
    const figure = page.getByRole("figure", { name: "Predicted and reported recovery" });
    await expect(figure).toHaveAccessibleDescription(/^4 workups: \d within 10 points of the prediction/);
    await expect(page.getByRole("figure", { name: "Spread of deviations" })).toHaveAccessibleDescription(/^\d+ workups?, from /);
    const legend = parity.getByTestId("chart-legend").getByRole("listitem");
    await expect(legend).toContainText(["Dichloromethane / water", "Ethyl acetate / water", "Perfect agreement", "±10 points"]);
    // Legend text is dark on white (the colour is in the swatch), 4.5:1 or better.
    for (const color of await legend.evaluateAll((items) => items.map((i) => getComputedStyle(i).color))) expect(color).toBe("rgb(41, 37, 36)");

    // One export menu per chart.
    const exportFrom = async (view: typeof parity, item: string) => {
      await view.getByTestId("export-menu").locator("summary").click();
      const [download] = await Promise.all([page.waitForEvent("download"), view.getByRole("button", { name: item }).click()]);
      return download;
    };
    await expect(page.getByTestId("export-menu")).toHaveCount(await page.locator("section[data-view]").count());
    const csv = await exportFrom(parity, "Data (CSV)");
    expect(csv.suggestedFilename()).toBe("parity.csv");
    const lines = fs.readFileSync(await csv.path(), "utf8").trim().split("\r\n");
    expect(lines[0]).toBe("workup_id,title,performed_on,solvent_system,predicted_pct,interval_low_pct,interval_high_pct,reported_pct");
    expect(lines).toHaveLength(5);

    const svg = await exportFrom(parity, "Image with legend (SVG)");
    expect(svg.suggestedFilename()).toBe("parity.svg");
    const markup = fs.readFileSync(await svg.path(), "utf8");
    expect(markup).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(markup).toContain("Predicted recovery (%)");
    // The legend is inside the image, and no entry runs past its right edge.
    const width = Number(/^<svg[^>]* width="(\d+)"/.exec(markup)?.[1]);
    const legendMarkup = /<g data-legend="">(.*?)<\/g>/.exec(markup)?.[1] ?? "";
    for (const label of ["Dichloromethane / water", "Ethyl acetate / water", "Perfect agreement", "±10 points"]) expect(legendMarkup).toContain(`>${label}</text>`);
    const texts = await page.evaluate((m) => {
      const doc = new DOMParser().parseFromString(m, "image/svg+xml");
      const host = document.body.appendChild(document.createElement("div"));
      host.appendChild(document.importNode(doc.documentElement, true));
      const right = [...host.querySelectorAll("g[data-legend] text")].map((t) => (t as SVGTextElement).getBBox()).map((b) => b.x + b.width);
      host.remove();
      return right;
    }, markup);
    expect(texts.length).toBe(4);
    for (const right of texts) expect(right).toBeLessThanOrEqual(width);

    const histogram = section(page, "Spread of deviations");
    const png = await exportFrom(histogram, "Image with legend (PNG)");
    expect(png.suggestedFilename()).toBe("deviation-histogram.png");
    const pngBytes = fs.readFileSync(await png.path());
    expect(pngBytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
    // Twice the chart's height plus the legend's row: the legend was not cut off.
    const chartHeight = await histogram.locator(".recharts-wrapper > svg.recharts-surface").evaluate((e) => e.getBoundingClientRect().height);
    expect(pngBytes.readUInt32BE(20)).toBeGreaterThanOrEqual(2 * (chartHeight + 20));

    await page.emulateMedia({ media: "print" });
    await expect(page.getByRole("navigation", { name: "Main" })).toBeHidden();
    await expect(page.getByRole("form", { name: "Review filters" })).toBeHidden();
    await expect(parity.getByTestId("export-menu")).toBeHidden();
    await expect(parity.locator(".recharts-wrapper > svg.recharts-surface")).toBeVisible();
    const pdf = await page.pdf({ format: "A4", printBackground: true });
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    // The views that start on a new page: spread, solvent systems, chemists and the flagged list, after the first.
    const pages = pdf.toString("latin1").match(/\/Type\s*\/Page[^s]/g) ?? [];
    expect(pages.length).toBeGreaterThanOrEqual(5);
  });
});
