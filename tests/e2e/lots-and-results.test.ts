import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { expectAccessible, screenshot, signInThroughForm, signOut, startStack, type Stack } from "../support/stack.ts";
import { DEMO } from "../support/api.ts";

let s: Stack;
beforeAll(async () => {
  s = await startStack();
});
afterAll(() => s?.stop());

const nav = (label: string) => s.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: label, exact: true }).click();
const fixture = path.resolve(import.meta.dirname, "../fixtures/sentier-blanc-prefilling.csv");

describe("lots and results: import, certificate, verdicts and trends", () => {
  it("when the producer imports the lab's CSV for Sentier Blanc, then the preview reads it and the import reports two failing parameters", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.producerQuality);
    await nav("Specifications");
    await page.getByRole("link", { name: "Sentier Blanc" }).first().click();
    await page.getByRole("link", { name: "Import results (CSV)" }).click();
    await page.getByLabel("CSV file").setInputFiles(fixture);
    await page.getByText("2 samples", { exact: true }).waitFor();
    await page.getByLabel("Laboratory").fill("Domaine des Trois Sentes cellar laboratory");
    expect(await page.getByLabel("Meaning of column VA (g/L acetic)").inputValue()).toBe("parameter:volatile_acidity");
    await expectAccessible(page, "import preview");
    await screenshot(page, "import-preview");
    await page.getByRole("button", { name: "Import 2 samples" }).click();
    await page.getByText(/Results: \d+ pass.* of 2 samples pass on every required parameter; 1 falls outside the specification/).waitFor();
    const e2 = page.getByRole("row").filter({ has: page.getByRole("cell", { name: "SB-25-E2", exact: true }) });
    expect(await e2.getByRole("cell", { name: "Free SO2, Volatile acidity" }).count()).toBe(1);
    await screenshot(page, "import-done");
  });

  it("when a French lab file has a value far outside what wine can be, then the preview holds it back until the producer confirms it", async () => {
    const { page } = s;
    await nav("Specifications");
    await page.getByRole("link", { name: "Sentier Blanc" }).first().click();
    await page.getByRole("link", { name: "Import results (CSV)" }).click();
    await page.getByLabel("CSV file").setInputFiles(path.resolve(import.meta.dirname, "../fixtures/laboratoire-francais.csv"));
    await page.getByText("3 samples", { exact: true }).waitFor();
    await page.getByLabel("Laboratory").fill("Laboratoire Vauclair");
    // Units come from the French headers: volatile acidity stays in g/L as sulfuric acid.
    expect(await page.getByLabel("Unit of column Acidité volatile (g/L H2SO4)").inputValue()).toBe("g/L as sulfuric acid");
    await page.getByText(/1 value looks implausible/).waitFor();
    await page.getByText(/Row 3, TAV \(% vol\): Implausible: check the unit/).waitFor();
    const send = page.getByRole("button", { name: "Import 3 samples" });
    expect(await send.isDisabled()).toBe(true);
    await page.getByLabel(/I have checked these values and their units/).check();
    expect(await send.isEnabled()).toBe(true);
    await expectAccessible(page, "import with an implausible value");
    await screenshot(page, "import-implausible");
  });

  it("when the producer opens the failing lot and attaches the certificate, then the certificate is listed with its hash", async () => {
    const { page } = s;
    await nav("Lots");
    // Among thousands of lots, as a technologist would: by its code.
    await page.getByLabel("Lot code contains").fill("SB-25-E2");
    await page.getByRole("link", { name: "SB-25-E2" }).click();
    await page.getByRole("heading", { level: 1, name: "Lot SB-25-E2" }).waitFor();
    const dir = mkdtempSync(path.join(os.tmpdir(), "cert-"));
    const file = path.join(dir, "northgate-certificate.pdf");
    writeFileSync(file, "%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");
    await page.getByLabel(/Attach the laboratory's certificate/).setInputFiles(file);
    await page.getByText(/Attached. SHA-256/).waitFor();
    await page.getByRole("link", { name: /Certificate: northgate-certificate.pdf/ }).waitFor();
    await expectAccessible(page, "lot page (producer)");
    await signOut(page);
  });

  it("when the buyer opens the lot, then each verdict shows its governing limit and the law with its citation, and the trend chart draws", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await nav("Lots");
    // Among thousands of lots, as a technologist would: by its code.
    await page.getByLabel("Lot code contains").fill("SB-25-E2");
    await page.getByRole("link", { name: "SB-25-E2" }).click();
    const va = page.getByRole("row", { name: "Volatile acidity", exact: true });
    await va.getByText("fail", { exact: true }).waitFor();
    await va.getByText(/max 0\.60 g\/L as acetic acid \(buyer's spec\)/).waitFor();
    // 18 meq/L for white wine, shown in the buyer's unit (Oxford Companion: 1 meq = 0.060 g acetic acid → 1.08 g/L); the lot is for Great Britain, where 2019/934 is retained.
    await va
      .getByText(
        /Law, GB: max 1\.08\d* g\/L as acetic acid \(Commission Delegated Regulation \(EU\) 2019\/934 as retained in the law of Great Britain/,
      )
      .waitFor();
    await page.getByRole("row", { name: "Free SO2", exact: true }).getByText("fail", { exact: true }).waitFor();
    await page.getByRole("link", { name: /Certificate: northgate-certificate.pdf/ }).waitFor();
    await expectAccessible(page, "lot page (buyer)");
    await screenshot(page, "lot-buyer");

    await page.getByRole("link", { name: "Trends" }).click();
    await page.getByRole("img", { name: /Chart of Volatile acidity/ }).waitFor();
    // In the spec row's unit, with a legend entry for every line, the limit among them (regression).
    await page.getByRole("heading", { name: "Volatile acidity (g/L as acetic acid)" }).waitFor();
    const legend = page.locator(".recharts-legend-wrapper");
    for (const entry of ["Max 0.60 (buyer)", "Result", "Outside the limits"]) await legend.getByText(entry, { exact: true }).waitFor();
    expect(await page.locator(".recharts-line").count()).toBeGreaterThanOrEqual(2);
    await page.getByRole("table", { name: "Results" }).waitFor();
    await expectAccessible(page, "trends");
    await screenshot(page, "trends");

    await nav("Readiness");
    await page.getByRole("heading", { level: 1, name: "Readiness" }).waitFor();
    await page.waitForLoadState("networkidle");
    await expectAccessible(page, "readiness");
    await screenshot(page, "readiness");
    await signOut(page);
  });
});
