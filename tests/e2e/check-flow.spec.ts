// The loop the QR code closes: scan a posted poster, read "current"; a size it prints goes out
// of stock, the check page says "outdated" and names it, the managers get one e-mail naming the
// room; restoring the size makes the printout current again.
import { expect, test, type Page } from "@playwright/test";
import { jsqrDecode, rasterise, zbarDecode } from "../support/pdf-tools";
import { demoEmail, signInPage } from "./support/auth";
import { demoIds } from "./support/db";
import { mailTo, waitForMail } from "../support/mail";
import { settleStaleMail } from "./support/mail";

const SWITCH = "NC family A (illustrative) 3.75 mm in stock";

async function setInStock(page: Page, inStock: boolean) {
  await page.goto("/labs/demo/stock");
  const toggle = page.getByRole("switch", { name: SWITCH });
  if ((await toggle.getAttribute("aria-checked")) !== String(inStock)) {
    await toggle.click();
    if (!inStock) {
      // The size is printed on a posted copy: the manager is told which room before it is saved.
      const dialog = page.getByRole("dialog");
      await expect(dialog).toContainText("Posted copies will go out of date");
      await dialog.getByRole("button", { name: "Mark out of stock" }).click();
    }
  }
  await expect(toggle).toHaveAttribute("aria-checked", String(inStock));
  await expect(page.getByText(`3.75 mm marked ${inStock ? "in stock" : "out of stock"}`)).toBeVisible();
}

test("a posted poster's QR code reports current, outdated with the size named, and current again", async ({
  page,
  baseURL,
}) => {
  const ids = await demoIds();
  await signInPage(page, demoEmail("manager"));
  await settleStaleMail(demoEmail("manager"));
  const mailsBefore = (await mailTo(demoEmail("manager"))).length;

  // Download the approved POT poster and read its QR code with two independent decoders.
  const res = await page.request.get(`/api/v1/editions/${ids["edition:pot"]}/pdf`);
  expect(res.status()).toBe(200);
  const png = rasterise(Buffer.from(await res.body()), 100);
  const url = jsqrDecode(png)?.text;
  expect(url).toBe(`${baseURL}/v/${ids["token:pot"]}`);
  expect(zbarDecode(png)).toEqual([url]);

  await page.goto(url!);
  await expect(page.getByTestId("check-status")).toHaveAttribute("data-status", "current");
  await expect(
    page
      .getByRole("region", { name: "Where this copy hangs" })
      .getByRole("listitem")
      .filter({ hasText: "Procedure room 1" }),
  ).toBeVisible();

  await setInStock(page, false);
  await page.goto(url!);
  await expect(page.getByTestId("check-status")).toHaveAttribute("data-status", "outdated");
  await expect(page.getByTestId("check-changes")).toContainText("3.75 mm NC balloon no longer stocked");

  const mails = await waitForMail(demoEmail("manager"), mailsBefore + 1);
  const notice = mails.at(-1)!;
  expect(notice.subject).toContain("to replace");
  expect(notice.text).toContain("Procedure room 1");
  expect(notice.text).toContain("3.75 mm NC balloon no longer stocked");

  await setInStock(page, true);
  await page.goto(url!);
  await expect(page.getByTestId("check-status")).toHaveAttribute("data-status", "current");
  // Restoring sends one all-clear after the quiet period, and nothing else.
  const cleared = await waitForMail(demoEmail("manager"), mailsBefore + 2);
  expect(cleared.at(-1)!.subject).toContain("is current again");
  // Nothing waits for a digest any more, so no third e-mail can follow.
  await settleStaleMail(demoEmail("manager"));
  expect(await mailTo(demoEmail("manager"))).toHaveLength(mailsBefore + 2);
});

test("the check page works without JavaScript and without signing in, and an unknown token is a 404", async ({
  browser,
}) => {
  const ids = await demoIds();
  const context = await browser.newContext({ javaScriptEnabled: false });
  const page = await context.newPage();
  const res = await page.goto(`/v/${ids["token:pot"]}`);
  expect(res?.status()).toBe(200);
  await expect(page.getByTestId("check-status")).toContainText("Current");
  await expect(page.getByRole("note", { name: "Clinical caution" })).toBeVisible();
  await expect(page.getByText(/Dr |demo manager|@forkwall/)).toHaveCount(0);
  expect((await page.goto("/v/AAAAAAAAAAAAAAAAAAAAAAAA"))?.status()).toBe(404);
  await context.close();
});
