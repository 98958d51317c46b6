/**
 * One answer everywhere, in Chromium: three lots (one conforms, one fails, one accepted under
 * concession) read the same status words on the lots list, the lot page, the readiness board and
 * in the text of the document the lot page offers (read back with pdftotext).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { expectAccessible, screenshot, signInThroughForm, startStack, type Stack } from "../support/stack.ts";
import { buildTestApp, DEMO, type TestApp } from "../support/api.ts";
import { setUpThreeLots, THREE_LOT_STATUSES, type ThreeLots } from "../support/three-lots.ts";

let s: Stack;
let api: TestApp;
let lots: ThreeLots;
const tag = randomUUID().slice(0, 5);

beforeAll(async () => {
  s = await startStack();
  // The lots are made through the services, on the same database the browser's server uses.
  api = buildTestApp();
  lots = await setUpThreeLots(tag);
});
afterAll(async () => {
  await s?.stop();
  await api?.close();
});

const statusIn = (scope: ReturnType<Stack["page"]["locator"]>) => scope.locator("[data-lot-status]").first().innerText();

describe("one status per lot, on every screen and document", () => {
  it("when the buyer looks at the three lots, then the lots list, the lot page, the readiness board and the document say the same", async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, DEMO.buyerTechnologist);
    await page.goto(`${baseUrl}/lots?q=${tag}`);
    await page.getByRole("link", { name: lots.good.code }).waitFor();
    await expectAccessible(page, "lots list with statuses");
    await screenshot(page, "lot-status-list");
    const seen: Record<string, string[]> = {};
    for (const key of Object.keys(THREE_LOT_STATUSES)) {
      const lot = lots[key as keyof ThreeLots];
      seen[key] = [await statusIn(page.getByRole("row").filter({ has: page.getByRole("link", { name: lot.code }) }))];
    }
    await page.goto(`${baseUrl}/readiness`);
    for (const key of Object.keys(THREE_LOT_STATUSES)) {
      const row = page.getByRole("row").filter({ has: page.getByRole("link", { name: lots[key as keyof ThreeLots].code }) });
      await row.waitFor();
      seen[key]!.push(await statusIn(row));
    }
    const conceded = page.getByRole("row").filter({ has: page.getByRole("link", { name: lots.conceded.code }) });
    expect(await conceded.getByText(/open deviation/).count()).toBe(0);
    await conceded.getByText(/: Concession for this lot$/).waitFor();
    await screenshot(page, "lot-status-readiness");
    for (const key of Object.keys(THREE_LOT_STATUSES)) {
      const lot = lots[key as keyof ThreeLots];
      await page.goto(`${baseUrl}/lots/${lot.id}`);
      await page.getByRole("heading", { level: 1, name: `Lot ${lot.code}` }).waitFor();
      seen[key]!.push(await statusIn(page.locator("header").filter({ has: page.getByRole("heading", { level: 1 }) })));
      const link = page.getByRole("link", { name: /^(Certificate of conformity|Analysis statement) \(PDF\)$/ });
      const download = await Promise.all([page.waitForEvent("download"), link.click()]).then(([d]) => d);
      const text = execFileSync("pdftotext", [await download.path(), "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
      const said =
        text.match(
          /Status: (Conforms with conditional results|Conforms|Does not conform|Accepted under concession|Results incomplete|Rejected)/,
        )?.[1] ?? "none";
      seen[key]!.push(said);
      if (key === "conceded") {
        await expectAccessible(page, "lot page accepted under concession");
        await screenshot(page, "lot-status-concession");
      }
    }
    expect(seen).toEqual({
      good: Array(4).fill(THREE_LOT_STATUSES.good[1]),
      bad: Array(4).fill(THREE_LOT_STATUSES.bad[1]),
      conceded: Array(4).fill(THREE_LOT_STATUSES.conceded[1]),
    });
  });
});
