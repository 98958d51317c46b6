/**
 * The paid audit from end to end in Chromium: finance orders and pays on the Stripe fake's page
 * (a declined card first, Stripe's test numbers from docs.stripe.com/testing), the laboratory fills
 * its results from its CSV export and sends them, the buyer sees the comparison and downloads the
 * certificate of conformity.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { randomUUID } from "node:crypto";
import { expectAccessible, screenshot, signInThroughForm, signOut, startStack, type Stack } from "../support/stack.ts";
import { DEMO, ORG, CONTRACT } from "../support/api.ts";

let s: Stack;
let orderUrl = "";
const lotCode = `SB-25-A${randomUUID().slice(0, 4)}`;

beforeAll(async () => {
  s = await startStack();
});
afterAll(() => s?.stop());

const nav = (label: string) => s.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: label, exact: true }).click();

/** Calls the API with the browser's own session, as the page script would. */
async function asSignedIn(path: string, body: unknown) {
  const csrf = (await s.context.cookies()).find((c) => c.name === "cp_csrf")!.value;
  const res = await s.page.request.post(`${s.baseUrl}${path}`, { data: body, headers: { "x-csrf-token": decodeURIComponent(csrf) } });
  expect(res.status()).toBe(201);
  return res.json();
}

describe("a paid independent audit", () => {
  it("given a lot whose producer declared its results", async () => {
    await signInThroughForm(s.page, s.baseUrl, DEMO.producerQuality);
    const lot = await asSignedIn(`/api/orgs/${ORG.troisSentes}/lots`, {
      contractId: CONTRACT.sentierBlanc,
      vintage: 2025,
      lotCode,
      volumeLitres: 11000,
      container: "bottles",
      plannedDate: "2027-01-20",
      market: "EU",
    });
    await asSignedIn(`/api/orgs/${ORG.troisSentes}/lots/${lot.id}/analyses`, {
      idempotencyKey: randomUUID(),
      stage: "pre_filling",
      laboratoryName: "Domaine des Trois Sentes cellar laboratory",
      sampleDate: "2026-11-24",
      results: [
        { parameter: "volatile_acidity", raw: "0.39", unit: "g/L as acetic acid", uncertainty: { kind: "expanded", value: 0.03, k: 2 } },
        { parameter: "free_so2", raw: "33", unit: "mg/L", uncertainty: { kind: "expanded", value: 3, k: 2 } },
      ],
    });
    await signOut(s.page);
  });

  it("when finance orders an audit and a declined card is followed by a good one, then the order is paid", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerFinance);
    await nav("Audits");
    await page.getByRole("heading", { name: "Spend on audits" }).waitFor();
    await page.getByRole("button", { name: "Order an audit" }).click();
    await page.getByLabel("Contract", { exact: true }).selectOption({ label: "Sentier Blanc — Domaine des Trois Sentes (HG-C-2024-017)" });
    await page.getByLabel("Laboratory", { exact: true }).selectOption({ label: "Northgate Oenology Laboratory" });
    await page.getByRole("checkbox", { name: new RegExp(lotCode) }).check();
    await page.getByRole("checkbox", { name: /^Volatile acidity/ }).check();
    await page.getByRole("checkbox", { name: /^Free SO2/ }).check();
    await page.getByText("Total: €30.00").waitFor();
    await expectAccessible(page, "order an audit");
    await screenshot(page, "audit-order-form");
    await page.getByRole("button", { name: "Place the order" }).click();
    await page.getByRole("heading", { level: 1, name: /^Audit AUD-\d{5}$/ }).waitFor();
    orderUrl = page.url();
    await page.getByText("Awaiting payment").first().waitFor();

    await page.getByRole("button", { name: "Pay €30.00" }).click();
    await page.getByRole("heading", { name: "Test payment" }).waitFor();
    const pay = async (card: string) => {
      await page.getByLabel("Card number").fill(card);
      await page.getByLabel("Expiry (MM / YY)").fill("12 / 34");
      await page.getByLabel("CVC").fill("123");
      await page.getByLabel("Name on card").fill("Owen Pryce");
      await page.getByRole("button", { name: "Pay €30.00" }).click();
    };
    await pay("4000 0000 0000 0002");
    await page.getByRole("alert").getByText("Your card was declined.").waitFor();
    await pay("4242 4242 4242 4242");
    await page.getByText("Payment confirmed.").waitFor({ timeout: 20_000 });
    await page.getByText("Paid, with the laboratory").first().waitFor();
    await page.getByText("Payment declined").first().waitFor();
    await expectAccessible(page, "audit order (finance)");
    await screenshot(page, "audit-paid");
    const receipt = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Download the receipt (PDF)" }).click(),
    ]).then(([d]) => d.path());
    expect(execFileSync("pdftotext", [receipt, "-"], { encoding: "utf8" })).toContain("Receipt for independent audit");
    await signOut(page);
  });

  it("when the laboratory fills its results from its CSV export and sends them, then the discrepancy opens a deviation", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.labAnalyst);
    await nav("Audits");
    await page.getByRole("heading", { level: 1, name: "Audits" }).waitFor();
    await page
      .getByRole("link", { name: /^AUD-\d{5}$/ })
      .first()
      .waitFor();
    await page.goto(orderUrl);
    await page.getByRole("heading", { name: "Your results" }).waitFor();
    await page.getByLabel("Report reference").fill("NG-26-2041");
    await page.getByLabel("Fill from a CSV export").setInputFiles({
      name: "northgate-export.csv",
      mimeType: "text/csv",
      buffer: Buffer.from(`Lot;Volatile acidity (g/L as acetic acid);Free SO2 (mg/L)\n${lotCode};0,52 ± 0,03;34 ± 3\n`),
    });
    await page.getByText("2 result(s) filled from northgate-export.csv.").waitFor();
    await expect.poll(() => page.getByRole("textbox", { name: `Volatile acidity, lot ${lotCode}`, exact: true }).inputValue()).toBe("0,52");
    await expectAccessible(page, "audit order (laboratory)");
    await screenshot(page, "audit-lab-results");
    await page.getByRole("button", { name: "Send the results" }).click();
    await page
      .getByRole("dialog", { name: /^Send the results for AUD-\d{5}\?$/ })
      .getByRole("button", { name: "Send the results" })
      .click();
    // Either the confirmation or an error message: say which, so a failure names its cause.
    const outcome = page.getByText(/Results sent\./).or(page.getByRole("alert"));
    await outcome.first().waitFor({ timeout: 20_000 });
    expect(await outcome.first().textContent()).toMatch(/1 lot\(s\) disagree with the declared results/);
    await page.getByLabel(`Attach your signed report for lot ${lotCode}`, { exact: false }).setInputFiles({
      name: "NG-26-2041.pdf",
      mimeType: "application/pdf",
      buffer: Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n"),
    });
    await page.getByText(/Attached\. SHA-256/).waitFor();
    await nav("Deviations");
    await page.getByRole("cell", { name: lotCode }).first().waitFor();
    await signOut(page);
  });

  it("when the buyer opens the order, then it sees the comparison and downloads the lot's document, an analysis statement while results are missing", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await nav("Audits");
    await page
      .getByRole("link", { name: /^AUD-\d{5}$/ })
      .first()
      .waitFor();
    await page.goto(orderUrl);
    const row = page.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "Volatile acidity" }) });
    await row.getByText("discrepant", { exact: true }).waitFor();
    await page
      .getByRole("row")
      .filter({ has: page.getByRole("rowheader", { name: "Free SO2" }) })
      .getByText("agrees", { exact: true })
      .waitFor();
    await expectAccessible(page, "audit order (buyer)");
    await screenshot(page, "audit-comparison");
    const download = await Promise.all([
      page.waitForEvent("download"),
      page.getByRole("link", { name: "Conformity document (PDF)" }).first().click(),
    ]).then(([d]) => d);
    // The declared analysis gives two of the spec's rows, so the lot's status is "Results incomplete".
    expect(download.suggestedFilename()).toBe(`analysis-statement-${lotCode}.pdf`);
    const text = execFileSync("pdftotext", [await download.path(), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("Analysis statement");
    expect(text).toContain("Status: Results incomplete");
    expect(text).toContain("Northgate Oenology Laboratory");
    expect(text).toContain("report NG-26-2041");
    expect(text).toContain("does not replace the test report of an accredited laboratory");
    expect(
      readFileSync(await download.path())
        .subarray(0, 5)
        .toString(),
    ).toBe("%PDF-");
  });
});
