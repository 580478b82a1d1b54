// Issue flow for wall charts: an educator designs a chart and creates an edition, the medical
// lead approves it, and the approved poster PDF downloads and reads back right.
import { readFileSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { finetParent } from "../support/published-laws";
import { PNG } from "pngjs";
import { pdfImages, pdfInfo, pdfText } from "../support/pdf-tools";
import { demoEmail, signInPage } from "./support/auth";

test("design a chart, create an edition, approve it as another role and download the PDF", async ({ browser }) => {
  const title = `E2E POT chart ${Date.now().toString(36)}`;

  const educator = await (await browser.newContext()).newPage();
  await signInPage(educator, demoEmail("educator"));
  await educator.goto("/labs/demo/charts/new");
  await educator.getByLabel("Title").fill(title);
  // The live preview and its legibility check follow the form.
  await expect(educator.getByTestId("legibility")).toBeVisible();
  await educator.getByLabel("Paper").selectOption("A4");
  await educator.getByLabel("Reading distance (m)").fill("4");
  await expect(educator.getByTestId("legibility")).toContainText("Too small");
  await educator.getByLabel("Paper").selectOption("A1");
  await educator.getByLabel("Reading distance (m)").fill("1.5");
  await expect(educator.getByTestId("legibility")).toContainText("Legible");
  await educator.getByRole("button", { name: "Create chart" }).click();
  await expect(educator.getByRole("heading", { level: 1, name: title })).toBeVisible();

  // The lab logo: a text file named .png is refused from its bytes; a real PNG is taken.
  await educator.getByLabel("Logo file (PNG or JPEG, at most 1 MB)").setInputFiles({
    name: "logo.png",
    mimeType: "image/png",
    buffer: Buffer.from("not really a picture\n".repeat(10)),
  });
  await expect(educator.getByRole("alert").filter({ hasText: "must be a PNG or JPEG" })).toBeVisible();
  await educator
    .getByLabel("Logo file (PNG or JPEG, at most 1 MB)")
    .setInputFiles({ name: "logo.png", mimeType: "image/png", buffer: testPng() });
  await expect(educator.getByRole("img", { name: "Current lab logo" })).toBeVisible();
  const big = await educator.request.put(
    `${educator.url().replace(/\/labs\/demo\/charts\//, "/api/v1/charts/")}/logo`,
    {
      multipart: {
        file: { name: "big.png", mimeType: "image/png", buffer: Buffer.concat([testPng(), Buffer.alloc(1_100_000)]) },
      },
    },
  );
  expect(big.status()).toBe(413);

  await educator.getByRole("button", { name: "Create edition" }).click();
  await expect(educator.getByRole("status").filter({ hasText: "Edition 1 created" })).toBeVisible();
  const edition = educator.getByTestId("edition-1");
  await expect(edition).toContainText("Draft");
  // Four eyes: the author is not offered approval.
  await expect(edition.getByRole("button", { name: /Approve/ })).toHaveCount(0);
  const chartUrl = educator.url();

  const lead = await (await browser.newContext()).newPage();
  await signInPage(lead, demoEmail("lead"));
  await lead.goto(chartUrl);
  await lead
    .getByTestId("edition-1")
    .getByLabel(/I have reviewed edition 1/)
    .check();
  await lead.getByTestId("edition-1").getByRole("button", { name: "Approve edition 1" }).click();
  await expect(lead.getByRole("status").filter({ hasText: "Edition 1 approved" })).toBeVisible();
  await expect(lead.getByTestId("edition-1")).toContainText("Approved");

  const [download] = await Promise.all([
    lead.waitForEvent("download"),
    lead.getByTestId("edition-1").getByRole("link", { name: "Download PDF" }).click(),
  ]);
  const pdf = readFileSync(await download.path());
  // ISO 216 A1 portrait: 594 x 841 mm = 1683.78 x 2383.94 pt.
  const info = pdfInfo(pdf);
  expect(info.pages).toBe(1);
  expect(info.widthPt).toBeCloseTo((594 * 72) / 25.4, 0);
  expect(info.heightPt).toBeCloseTo((841 * 72) / 25.4, 0);
  // Long lines wrap on the poster: compare with white space folded.
  const text = (await pdfText(pdf)).text.replace(/\s+/g, " ");
  expect(text).toContain(title);
  expect(text).toContain("Edition 1");
  expect(text).toContain("Dr Lee Okafor");
  expect(text).toContain("Reference aid only");
  // A cell the default axes include: MB 3.00, SB 2.50 -> Finet parent 0.678 x 5.5 = 3.729 mm
  // (Finet et al., EuroIntervention 2008), printed as its exact value.
  expect(text).toContain(finetParent(3, 2.5).toFixed(2));

  // The logo is embedded as an image (poppler's pdfimages lists it).
  expect(pdfImages(pdf)).toBeGreaterThanOrEqual(1);

  // A second download is served from the render cache.
  const href = await lead.getByTestId("edition-1").getByRole("link", { name: "Download PDF" }).getAttribute("href");
  const again = await lead.request.get(href!);
  expect(again.headers()["x-render-cache"]).toBe("hit");
  expect(Buffer.from(await again.body()).equals(pdf)).toBe(true);
});

function testPng(): Buffer {
  const img = new PNG({ width: 60, height: 24 });
  for (let i = 0; i < img.data.length; i += 4) img.data.set([22, 79, 93, 255], i);
  return PNG.sync.write(img);
}
