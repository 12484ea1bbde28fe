// Attachments in a browser: a member attaches a TLC photo to a workup and sees its preview; a member of another
// group gets not-found for the file, its preview and the workup.
import { expect, test } from "@playwright/test";
import { fixtures, signIn, signOut } from "./helpers";
import { PEOPLE } from "./people";

// A 1×1 PNG (PNG specification, ISO/IEC 15948: signature, IHDR, IDAT, IEND).
const PNG_1X1 = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64");

test("a member attaches a photo; another group's member gets not-found for it", async ({ page }) => {
  await signIn(page, PEOPLE.memberA);
  await page.goto(`/workups/${fixtures().workupA}`);
  await page.getByLabel(/Attach files/).setInputFiles({ name: "tlc-plate.png", mimeType: "image/png", buffer: PNG_1X1 });
  await expect(page.getByRole("status").filter({ hasText: "tlc-plate.png: attached." })).toBeVisible();
  const item = page.getByTestId("attachments").getByRole("listitem").filter({ hasText: "tlc-plate.png" });
  await expect(item.getByRole("img", { name: "Preview of tlc-plate.png" })).toBeVisible();
  const href = await item.getByRole("link", { name: "tlc-plate.png", exact: true }).getAttribute("href");
  const fileUrl = (href ?? "").replace(/\?download=1$/, "");
  const own = await page.request.get(fileUrl);
  expect(own.status()).toBe(200);
  expect(Buffer.from(await own.body())).toEqual(PNG_1X1);

  await signOut(page);
  await signIn(page, PEOPLE.memberB);
  for (const url of [fileUrl, `${fileUrl}/thumbnail`]) {
    const response = await page.request.get(url);
    expect(response.status()).toBe(404);
  }
  expect((await page.goto(`/workups/${fixtures().workupA}`))?.status()).toBe(404);
});
