import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { expectAccessible, screenshot, signInThroughForm, signOut, startStack, type Stack } from "../support/stack.ts";
import { DEMO } from "../support/api.ts";

let s: Stack;
beforeAll(async () => {
  s = await startStack();
});
afterAll(() => s?.stop());

const nav = (label: string) => s.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: label }).click();

describe.sequential("spec sheets from draft to agreed version, then a tightened second version", () => {
  let v1Url = "";

  it("when the buyer drafts v1 of Sentier Rouge from the red template, then the live check cites the law and the draft saves itself and is sent", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await nav("Specifications");
    await page.getByRole("heading", { level: 1, name: "Specifications" }).waitFor();
    await page.getByRole("link", { name: "Sentier Rouge" }).first().click();
    await page.getByRole("heading", { level: 1, name: "Sentier Rouge" }).waitFor();
    await expectAccessible(page, "contract");
    await page.getByLabel("Start from").selectOption("template");
    await page.getByLabel("Template").selectOption("still-red");
    await page.getByRole("button", { name: "Create draft" }).click();
    await page.getByRole("heading", { name: "Requirements (draft)" }).waitFor();
    v1Url = page.url();

    // The live check beside volatile acidity shows the EU limit with its citation.
    const va = page.getByRole("row", { name: "Volatile acidity", exact: true });
    await va.getByText("EU: at most 20 meq/L").waitFor();
    await va
      .getByText(/Commission Delegated Regulation \(EU\) 2019\/934/)
      .first()
      .waitFor();

    // An impossible range is flagged at once, and nothing is saved until it is fixed.
    const ph = page.getByRole("row", { name: "pH", exact: true });
    await ph.getByLabel("Min").fill("3,9");
    await ph.getByText("The lower limit (3.9) is above the upper limit (3.8).").waitFor();
    await page.getByText("Not saved: fix the marked fields first.").waitFor();
    await ph.getByLabel("Min").fill("3,4");
    // A limit looser than the law gets a warning that names the governing law.
    await va.getByLabel("Max").fill("1.5");
    await va.getByText(/Your upper limit is looser than the law/).waitFor();
    await va.getByLabel("Max").fill("0.7");
    await page.getByText(/All changes saved at/).waitFor();
    await expectAccessible(page, "spec editor");
    await screenshot(page, "spec-editor");

    await page.getByRole("button", { name: "Send to producer" }).click();
    // A binding action asks first, in the page, and says what will happen.
    const ask = page.getByRole("dialog", { name: /^Send version \d+ to Domaine des Trois Sentes\?$/ });
    await ask.getByText(/cannot change/).waitFor();
    await expectAccessible(page, "send confirmation");
    await ask.getByRole("button", { name: "Send to the producer" }).click();
    await page.getByText(/it can no longer change/).waitFor();
    await signOut(page);
  });

  it("when the producer comments on a row and agrees, then the version is agreed", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.producerQuality);
    await page.goto(v1Url);
    await page.getByRole("button", { name: "Agree to this version" }).waitFor();
    await page.getByRole("button", { name: "Add a comment on Volatile acidity" }).click();
    await page.getByLabel("Comment on Volatile acidity").fill("Our 2024 lots ran between 0.52 and 0.63 g/L; 0.7 g/L suits us.");
    await page.getByRole("button", { name: "Post comment" }).click();
    await page.getByText("Our 2024 lots ran between 0.52 and 0.63 g/L").waitFor();
    await expectAccessible(page, "spec review");
    await screenshot(page, "spec-review-producer");
    await page.getByRole("button", { name: "Agree to this version" }).click();
    await page
      .getByRole("dialog", { name: /^Agree to version \d+\?$/ })
      .getByRole("button", { name: "Agree to this version" })
      .click();
    await page.getByText(/this version governs the lots/).waitFor();
    await signOut(page);
  });

  it("when the buyer makes v2 from v1 and tightens volatile acidity, then the diff, the backtest and the PDF show it", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await page.goto(v1Url);
    await page.getByRole("button", { name: "New version from this one" }).click();
    await page.getByRole("heading", { name: "Requirements (draft)" }).waitFor();
    await page.getByRole("heading", { level: 1, name: /version 2/ }).waitFor();
    await page.getByRole("row", { name: "Volatile acidity", exact: true }).getByLabel("Max").fill("0.55");
    await page.getByText(/All changes saved at/).waitFor();

    await page.getByRole("link", { name: "Compare and backtest" }).click();
    const vaRow = page.getByRole("row", { name: /Volatile acidity/ });
    await vaRow.getByText("tightened").waitFor();
    await page.getByRole("button", { name: "Run backtest" }).click();
    await page.getByText("3 lots of the 2024 vintage would now fail Volatile acidity.").waitFor();
    // The changes name the parameter as the catalogue does (regression: it printed the id, "volatile acidity").
    await page
      .getByRole("row", { name: /SR-24-3/ })
      .getByRole("cell", { name: "Volatile acidity", exact: true })
      .waitFor();
    expect(await page.getByRole("progressbar", { name: "Backtest progress" }).getAttribute("value")).toBe(
      await page.getByRole("progressbar", { name: "Backtest progress" }).getAttribute("max"),
    );
    await expectAccessible(page, "compare");
    await screenshot(page, "spec-compare-backtest");

    await page.getByRole("link", { name: "Back to version 2" }).click();
    const download = page.waitForEvent("download");
    await page.getByRole("link", { name: "Download PDF" }).click();
    const file = await (await download).path();
    const text = execFileSync("pdftotext", [file, "-"], { encoding: "utf8" });
    expect(text).toContain("Sentier Rouge");
    expect(text).toContain("version 2");
    expect(text).toContain("0.55");
    expect(readFileSync(file).subarray(0, 5).toString()).toBe("%PDF-");
    await signOut(page);
  });
});
