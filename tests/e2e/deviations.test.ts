import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectAccessible, openMail, screenshot, signInThroughForm, signOut, startStack, type Stack } from "../support/stack.ts";
import { DEMO } from "../support/api.ts";

let s: Stack;
let deviationUrl = "";
beforeAll(async () => {
  s = await startStack();
});
afterAll(() => s?.stop());

const nav = (label: string) => s.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: label, exact: true }).click();

describe("a deviation negotiated to a recorded decision", () => {
  it("when the producer enters a failing volatile acidity by hand, then a deviation opens and the producer asks for a concession", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.producerQuality);
    await nav("Lots");
    await page.getByText("Register a lot").click();
    const form = page.locator("details");
    await form.getByLabel("Contract").selectOption({ label: "HG-C-2024-017 · Sentier Blanc" });
    await form.getByLabel("Lot code", { exact: true }).fill("SB-25-D1");
    await form.getByLabel("Vintage").fill("2025");
    await form.getByLabel("Volume (litres)").fill("8000");
    await form.getByRole("button", { name: "Register the lot" }).click();
    await page.getByRole("heading", { level: 1, name: "Lot SB-25-D1" }).waitFor();
    await page.getByLabel("Laboratory", { exact: true }).fill("Domaine des Trois Sentes cellar laboratory");
    await page.getByRole("textbox", { name: "Volatile acidity", exact: true }).fill("0,74");
    await page
      .getByRole("row")
      .filter({ has: page.getByRole("textbox", { name: "Volatile acidity", exact: true }) })
      .getByText("fail", { exact: true })
      .waitFor();
    await page.getByRole("textbox", { name: "Free SO2", exact: true }).fill("31");
    await page.getByRole("button", { name: "Submit the analysis" }).click();
    await page.getByText(/A deviation was opened/).waitFor();
    await page.getByRole("link", { name: /Result deviation #\d+/ }).click();
    await page.getByRole("heading", { level: 1, name: /Deviation #\d+: lot SB-25-D1/ }).waitFor();
    deviationUrl = page.url();

    await page.getByLabel("Kind of message").selectOption("proposal");
    await page.getByLabel("Outcome").selectOption("concession");
    await page.getByLabel("Quote a result").selectOption({ index: 1 });
    await page
      .getByLabel("Message", { exact: true })
      .fill("The wine is sound and VA stays well below the legal 18 meq/L; we ask a concession for this lot. @tessa.marlow");
    await page.getByRole("button", { name: "Send the proposal" }).click();
    await page.getByRole("article", { name: /proposal by Élise Carbonnel/ }).waitFor();
    await expectAccessible(page, "deviation (producer)");
    await signOut(page);
  });

  it("when the buyer replies with a re-test condition and the producer accepts it, then the buyer decides with a reason", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await page.goto(deviationUrl);
    const ask = page.getByRole("article", { name: /proposal by Élise Carbonnel/ });
    await ask.getByRole("button", { name: /Reply/ }).click();
    await ask.getByLabel("Kind of message").selectOption("proposal");
    await ask.getByRole("button", { name: "Add a condition" }).click();
    await ask.getByLabel("What condition 1 requires").fill("Accredited re-test confirms VA below 0.8 g/L as acetic acid");
    await ask.getByLabel("Reply").fill("We can accept it on one condition.");
    await ask.getByRole("button", { name: "Send the proposal" }).click();
    await page.getByRole("article", { name: /proposal by Tessa Marlow/ }).waitFor();
    await signOut(page);

    await signInThroughForm(page, baseUrl, DEMO.producerQuality);
    await page.goto(deviationUrl);
    await page
      .getByRole("article", { name: /proposal by Tessa Marlow/ })
      .getByRole("button", { name: "Accept this proposal" })
      .click();
    const accepting = page.getByRole("dialog", { name: "Accept Tessa Marlow's proposal?" });
    await accepting
      .getByText("Concession for this lot, on condition of: re-test: Accredited re-test confirms VA below 0.8 g/L as acetic acid.")
      .waitFor();
    await accepting.getByRole("button", { name: "Accept the proposal" }).click();
    await page.getByRole("article", { name: /acceptance by Élise Carbonnel/ }).waitFor();
    await signOut(page);

    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await page.goto(deviationUrl);
    await page.getByLabel("Reason").fill("Sound wine, VA under the legal limit; concession with the agreed accredited re-test.");
    await page.getByRole("button", { name: "Record the decision" }).click();
    await page
      .getByRole("dialog", { name: /^Record the decision on deviation #\d+\?$/ })
      .getByRole("button", { name: "Record the decision" })
      .click();
    await page.getByRole("heading", { name: "Decision" }).waitFor();
    await page.getByText("Re-test: Accredited re-test confirms VA below 0.8 g/L as acetic acid").first().waitFor();
    await expectAccessible(page, "deviation decided");
    await screenshot(page, "deviation-decided");
  });

  it("when the parties look, then the mails are in the inbox and the trail shows every step and verifies", async () => {
    const { page } = s;
    const id = deviationUrl.split("/").pop();
    const trail = page.getByRole("list", { name: "Recorded events" });
    // The trail speaks in words, not action codes.
    for (const action of ["Deviation opened", "Outcome proposed", "Proposal accepted", "Deviation decided"])
      await trail.getByText(action, { exact: true }).first().waitFor();
    expect(await trail.getByText("deviation.decided").count()).toBe(0);
    expect(await trail.getByText("Outcome proposed", { exact: true }).count()).toBe(2);
    await page.getByRole("button", { name: "Verify the hash chain" }).click();
    await page.getByText(/The chain is intact/).waitFor();
    await screenshot(page, "deviation-trail");
    await signOut(page);

    await openMail(page, s.inboxUrl, `Deviation #${id} decided: Concession for this lot`);
    await page
      .getByRole("heading", { name: `Élise Carbonnel mentioned you on deviation #${id}` })
      .first()
      .waitFor();
    await screenshot(page, "deviation-inbox");
  });
});
