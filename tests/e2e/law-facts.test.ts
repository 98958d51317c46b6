/**
 * The buyer's technologist states what the law asks about a wine, and the spec page shows the limit
 * that follows: organic red wine from 2 g/L sugar keeps the conventional EU limit less 30 mg/L
 * (Reg. (EU) 2021/1165 Annex V as read in secondary sources; 150 − 30 = 120 mg/L for Kestrel Flats
 * Shiraz at 3.2 g/L).
 */
import { afterAll, beforeAll, describe, it } from "vitest";
import { expectAccessible, screenshot, signInThroughForm, startStack, type Stack } from "../support/stack.ts";
import { DEMO } from "../support/api.ts";

let s: Stack;
beforeAll(async () => {
  s = await startStack();
});
afterAll(() => s?.stop());

/** The Shiraz's contract, reached as a buyer would: from the specifications list. */
async function openShiraz() {
  const { page } = s;
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Specifications" }).click();
  await page.getByRole("link", { name: "Kestrel Flats Shiraz (bulk)" }).first().click();
  await page.getByRole("heading", { level: 1, name: "Kestrel Flats Shiraz (bulk)" }).waitFor();
}

async function stateOrganic(answer: "Yes" | "No") {
  const { page } = s;
  await page.getByRole("button", { name: "State the facts" }).click();
  await page.getByLabel("Whether it is organic").selectOption({ label: answer });
  await page.getByRole("button", { name: "Save the facts" }).click();
  await page.getByText(`Whether it is organic: ${answer}`).waitFor();
}

describe.sequential("the wine's facts for the law", () => {
  it("when the buyer states that the Shiraz is organic, then the contract lists it and its spec shows the organic EU limit beside the conventional one", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await openShiraz();
    await page.getByRole("heading", { name: "What the law asks about this wine" }).waitFor();
    await page.getByText("Whether it is organic: No").waitFor();
    await page.getByRole("button", { name: "State the facts" }).click();
    await page.getByLabel("Whether it is organic").waitFor();
    await expectAccessible(page, "law facts form");
    await screenshot(page, "law-facts-form");
    await page.getByRole("button", { name: "Cancel" }).click();
    await stateOrganic("Yes");

    await page.getByRole("link", { name: "Version 1" }).click();
    // The buyer's own limit is also 120 mg/L: look for the law's line, named by its market and its act.
    const so2 = page.getByRole("row", { name: /^Total SO2/ });
    await so2.getByText("EU: at most 120 mg/L").waitFor();
    await so2.getByText(/Implementing Regulation \(EU\) 2021\/1165/).waitFor();
    await screenshot(page, "law-facts-spec");

    await openShiraz();
    await stateOrganic("No");
  });
});
