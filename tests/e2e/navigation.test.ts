import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { expectAccessible, screenshot, signInThroughForm, signOut, startStack, type Stack } from "../support/stack.ts";
import { DEMO } from "../support/api.ts";

let s: Stack;
beforeAll(async () => {
  s = await startStack();
});
afterAll(() => s?.stop());

// What each role sees follows the permission table (shared/auth/permissions.ts).
const EXPECTED_NAV: [keyof typeof DEMO, string[]][] = [
  ["buyerTechnologist", ["Overview", "Specifications", "Lots", "Readiness", "Deviations", "Audits", "Profile"]],
  ["buyerFinance", ["Overview", "Specifications", "Lots", "Deviations", "Audits", "Profile"]],
  ["retailerAdmin", ["Overview", "Specifications", "Lots", "Deviations", "Members", "Trail", "Profile"]],
  ["producerQuality", ["Overview", "Specifications", "Lots", "Readiness", "Deviations", "Audits", "Profile"]],
  ["producerAdmin", ["Overview", "Specifications", "Lots", "Deviations", "Members", "Trail", "Profile"]],
  ["labAnalyst", ["Overview", "Deviations", "Audits", "Profile"]],
  ["labAdmin", ["Overview", "Deviations", "Members", "Trail", "Price list", "Profile"]],
  ["platformAdmin", ["Overview", "Organisations", "Profile"]],
];

describe("each demo role signs in and sees its own navigation", () => {
  it("when the sign-in page is shown, then it is accessible", async () => {
    await s.page.goto(`${s.baseUrl}/sign-in`);
    await s.page.getByRole("heading", { name: "Sign in" }).waitFor();
    await expectAccessible(s.page, "sign-in");
    await screenshot(s.page, "sign-in");
    await s.page.getByRole("button", { name: "Sign in" }).click();
    expect(await s.page.getByRole("alert").allTextContents()).toContain("Enter a valid e-mail address.");
  });

  for (const [who, nav] of EXPECTED_NAV) {
    it(`when ${who} signs in, then the navigation shows ${nav.join(", ")}`, async () => {
      await signInThroughForm(s.page, s.baseUrl, DEMO[who]);
      const links = await s.page.getByRole("navigation", { name: "Main" }).getByRole("link").allTextContents();
      expect(links).toEqual(nav);
      await expectAccessible(s.page, `${who} overview`);
      await screenshot(s.page, `overview-${who}`);
      for (const label of nav.slice(1)) {
        await s.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: label }).click();
        await s.page.getByRole("heading", { level: 1, name: label }).waitFor();
        await s.page.waitForLoadState("networkidle");
        await expectAccessible(s.page, `${who} ${label}`);
        await screenshot(s.page, `${who}-${label.toLowerCase().replace(/\s+/g, "-")}`);
      }
      await signOut(s.page);
    });
  }

  it("when an organisation admin takes a signed head of the trail, then its size, root and key show and it can be kept", async () => {
    await signInThroughForm(s.page, s.baseUrl, DEMO.retailerAdmin);
    await s.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Trail" }).click();
    await s.page.getByRole("button", { name: "Take a signed head" }).click();
    await s.page.getByText("Merkle root", { exact: true }).waitFor();
    await s.page.getByText(/^Ed25519 [0-9a-f]{16}…$/).waitFor();
    const download = s.page.waitForEvent("download");
    await s.page.getByRole("button", { name: "Download it" }).click();
    const kept = await download;
    expect(kept.suggestedFilename()).toMatch(/^trail-head-\d+\.json$/);
    // Sent back, the head checks out against the trail now.
    await s.page.getByLabel("Check a head you kept").setInputFiles((await kept.path())!);
    await s.page.getByText(/The head you kept is Cellarpact's, and the trail today/).waitFor();
    await expectAccessible(s.page, "trail with a signed head");
    await screenshot(s.page, "trail-signed-head");
    await signOut(s.page);
  });

  it("when a retailer opens a contract, then the producer's admin sees it waiting and accepts it", async () => {
    // The retailer's technologist opens the contract over the API, as the new-contract form does.
    const signIn = await fetch(`${s.baseUrl}/api/auth/sign-in`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ email: DEMO.buyerTechnologist, password: "Cellarpact-demo-2026" }),
    });
    const session = (await signIn.json()) as { csrfToken: string; user: { memberships: { organisationId: number }[] } };
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(";")[0])
      .join("; ");
    const retailerId = session.user.memberships[0]!.organisationId;
    const producers = (await (await fetch(`${s.baseUrl}/api/orgs/${retailerId}/producers`, { headers: { cookie } })).json()) as {
      id: number;
      name: string;
    }[];
    const reference = `E2E-${Date.now().toString(36)}`;
    const opened = await fetch(`${s.baseUrl}/api/orgs/${retailerId}/contracts`, {
      method: "POST",
      headers: { cookie, "x-csrf-token": session.csrfToken, "content-type": "application/json" },
      body: JSON.stringify({
        reference,
        producerOrgId: producers.find((p) => p.name.startsWith("Domaine des Trois Sentes"))!.id,
        startsOn: "2027-01-01",
        wine: { name: "Sentier Gris", colour: "rose", category: "still", region: "Loire Valley", markets: ["EU"] },
      }),
    });
    expect(opened.status).toBe(201);
    const { id } = (await opened.json()) as { id: number };

    await signInThroughForm(s.page, s.baseUrl, DEMO.producerAdmin);
    await s.page.goto(`${s.baseUrl}/contracts/${id}`);
    await s.page.getByText(/No specification reaches you until your organisation's admin accepts the contract/).waitFor();
    await expectAccessible(s.page, "contract waiting for acceptance");
    await screenshot(s.page, "contract-to-accept");
    await s.page.getByRole("button", { name: "Accept the contract" }).click();
    await s.page.getByRole("button", { name: "Accept the contract" }).waitFor({ state: "detached" });
    await signOut(s.page);
  });

  it("when a signed-out visitor opens a deep link, then sign-in comes first and leads back there", async () => {
    await s.page.goto(`${s.baseUrl}/profile`);
    await s.page.getByRole("heading", { name: "Sign in" }).waitFor();
    await s.page.getByLabel("E-mail address").fill(DEMO.labAnalyst);
    await s.page.getByLabel("Password").fill("Cellarpact-demo-2026");
    await s.page.getByRole("button", { name: "Sign in" }).click();
    await s.page.getByRole("heading", { level: 1, name: "Profile" }).waitFor();
    expect(new URL(s.page.url()).pathname).toBe("/profile");
    await signOut(s.page);
  });
});
