import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { build } from "vite";
import { chromium, type Browser } from "playwright-core";
import { mkdtempSync, readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import fc from "fast-check";
import * as engine from "../../shared/engine/index.ts";
import { chromiumPath } from "../support/stack.ts";

const root = path.resolve(import.meta.dirname, "../..");
let browser: Browser;
let bundle: string;

beforeAll(async () => {
  const outDir = mkdtempSync(path.join(os.tmpdir(), "cellarpact-engine-"));
  // The same Vite pipeline as the client build, producing the engine for a browser.
  await build({
    configFile: false,
    logLevel: "silent",
    root,
    build: {
      outDir,
      minify: true,
      lib: { entry: path.join(root, "shared/engine/index.ts"), name: "CellarpactEngine", formats: ["iife"], fileName: () => "engine.js" },
    },
  });
  bundle = readFileSync(path.join(outDir, "engine.js"), "utf8");
  browser = await chromium.launch({
    executablePath: chromiumPath(),
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking"],
  });
});
afterAll(() => browser?.close());

interface Case {
  row: engine.BuyerRequirement;
  markets: engine.MarketId[];
  profile: engine.WineProfile;
  input: engine.ResultInput;
}

/** Runs the same computations wherever `e` comes from; must stay self-contained for page.evaluate. */
function runAll(e: typeof engine, cases: Case[]) {
  return {
    verdicts: cases.map((c) => {
      const req = e.buildRequirement(c.row, c.markets, c.profile);
      return e.evaluate(req, c.input);
    }),
    molecular: e.molecularSo2(e.quantity(32, "mg/L"), e.quantity(3.41, "pH")),
    conversions: [
      e.convert(0.14, "g/100 mL as acetic acid", "meq/L"),
      e.convert(12.5, "% vol", "g/L ethanol"),
      e.convert(0.1, "mg/kg", "mg/L", { densityGPerMl: 0.9937 }),
    ],
    ewma: e.ewmaChart([52, 47, 53, 49.3, 50.1], { lambda: 0.3, target: 50, sigma: 2.0539 }),
    parsed: ["12,5", "<0.5", "n.d.", "> 300", "1,234.5"].map((t) => e.parseReading(t)),
    sugar: e.euStillSugarTerms(45),
  };
}

describe("the engine gives the same answers in Node and in the built browser bundle", () => {
  it("when 300 generated cases run in both, then every output is identical", async () => {
    const params = engine.PARAMETERS.filter((p) => p.kind === "quantity");
    const cases = fc
      .sample(
        fc.record({
          p: fc.constantFrom(...params),
          lower: fc.double({ min: 0, max: 50, noNaN: true }),
          width: fc.double({ min: 0.1, max: 500, noNaN: true }),
          value: fc.double({ min: 0, max: 600, noNaN: true }),
          u: fc.option(fc.double({ min: 0, max: 5, noNaN: true })),
          colour: fc.constantFrom("red" as const, "white" as const, "rose" as const),
          markets: fc.subarray(engine.MARKET_IDS),
        }),
        { numRuns: 300, seed: 7 },
      )
      .map((g): Case => ({
        row: {
          parameter: g.p.id,
          unit: g.p.unit,
          lower: g.p.bounds === "upper" ? null : g.lower,
          upper: g.lower + g.width,
          rule: engine.DEFAULT_DECISION_RULE,
        },
        markets: g.markets,
        profile: { colour: g.colour, category: "still", sugarGPerL: 3, harvestYear: 2024, alcoholPercentVol: 13 },
        input: {
          reading: { kind: "value", value: g.value },
          unit: g.p.unit,
          uncertainty: g.u === null ? null : { kind: "expanded", value: g.u, k: 2 },
        },
      }));
    const inNode = JSON.parse(JSON.stringify(runAll(engine, cases)));
    const page = await browser.newPage();
    await page.addScriptTag({ content: bundle });
    const inBrowser = await page.evaluate(
      ([source, data]) => {
        const run = new Function(`return (${source})`)();
        return JSON.parse(JSON.stringify(run((globalThis as unknown as { CellarpactEngine: unknown }).CellarpactEngine, data)));
      },
      [runAll.toString(), cases] as const,
    );
    expect(inBrowser.verdicts).toHaveLength(300);
    expect(inBrowser).toEqual(inNode);
    await page.close();
  });
});
