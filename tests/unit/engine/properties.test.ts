import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  buildRequirement,
  buyerRequirementSchema,
  compileRequirement,
  evaluateMany,
  STATEMENT_CODES,
  convert,
  evaluate,
  MARKET_IDS,
  PARAMETERS,
  resultForParameterSchema,
  UNITS,
  wineProfileSchema,
  type DecisionRule,
  type Outcome,
  type UnitId,
  type WineProfile,
} from "../../../shared/engine/index.ts";

const SEED = { seed: 20261202, numRuns: 500 };
const finite = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const quantityParams = PARAMETERS.filter((p) => p.kind === "quantity");

const ruleArb: fc.Arbitrary<DecisionRule> = fc.oneof(
  fc.constant({ kind: "simple" as const }),
  fc.record({
    kind: fc.constant("guarded" as const),
    guard: fc.record({ kind: fc.constantFrom("expanded" as const, "multiple-of-u" as const), k: finite(0.5, 3) }),
  }),
  fc.record({
    kind: fc.constant("non-binary" as const),
    guard: fc.record({ kind: fc.constantFrom("expanded" as const, "multiple-of-u" as const), k: finite(0.5, 3) }),
  }),
);

const profileArb: fc.Arbitrary<WineProfile> = fc.record(
  {
    colour: fc.constantFrom("red" as const, "white" as const, "rose" as const),
    category: fc.constantFrom(
      "still" as const,
      "sparkling" as const,
      "quality-sparkling" as const,
      "semi-sparkling" as const,
      "liqueur" as const,
    ),
    sugarGPerL: finite(0, 300),
    harvestYear: fc.integer({ min: 1990, max: 2030 }),
    alcoholPercentVol: finite(5, 22),
  },
  { requiredKeys: ["colour", "category"] },
);

const ORDER: Outcome[] = ["pass", "conditional pass", "conditional fail", "fail"];

describe("engine properties (fast-check, fixed seed)", () => {
  it("when a value lies strictly inside the buyer's range and the uncertainty is zero, then it passes under every rule", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...quantityParams),
        finite(0, 1000),
        finite(0.001, 1000),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        ruleArb,
        (p, lower, width, t, rule) => {
          const upper = lower + width;
          const req = buildRequirement({ parameter: p.id, unit: p.unit, lower, upper, rule }, [], { colour: "red", category: "still" });
          const v = evaluate(req, {
            reading: { kind: "value", value: lower + t * width },
            unit: p.unit,
            uncertainty: { kind: "standard", value: 0 },
          });
          return v.outcome === "pass";
        },
      ),
      SEED,
    );
  });

  it("when a value is converted to another unit of its parameter and back, then it round-trips", () => {
    fc.assert(
      fc.property(fc.constantFrom(...quantityParams.filter((p) => p.units.length > 1)), finite(0.001, 1e6), fc.nat(), (p, x, pick) => {
        const to = p.units[pick % p.units.length] as UnitId;
        const back = convert(convert(x, p.unit, to, { densityGPerMl: 0.995 }), to, p.unit, { densityGPerMl: 0.995 });
        return Math.abs(back - x) <= 1e-9 * Math.max(1, x);
      }),
      SEED,
    );
  });

  it("when the measured value rises against an upper limit, then the outcome never improves", () => {
    fc.assert(
      fc.property(
        finite(1, 100),
        finite(0, 5),
        ruleArb,
        fc.array(finite(0, 200), { minLength: 2, maxLength: 12 }),
        (upper, u, rule, xs) => {
          const req = buildRequirement({ parameter: "total_so2", unit: "mg/L", upper, rule }, [], { colour: "white", category: "still" });
          const outcomes = [...xs]
            .sort((a, b) => a - b)
            .map(
              (x) =>
                evaluate(req, { reading: { kind: "value", value: x }, unit: "mg/L", uncertainty: { kind: "standard", value: u } }).outcome,
            );
          return outcomes.every((o, i) => i === 0 || ORDER.indexOf(o) >= ORDER.indexOf(outcomes[i - 1]!));
        },
      ),
      SEED,
    );
  });

  it("when every input is valid for the engine's schemas, then building and evaluating never throws", () => {
    const unitIds = Object.keys(UNITS) as UnitId[];
    let exercised = 0;
    fc.assert(
      fc.property(
        fc.constantFrom(...PARAMETERS),
        fc.option(finite(-1, 1e4), { freq: 3 }),
        fc.option(finite(0, 1e4), { freq: 5 }),
        fc.option(fc.double({ min: -0.1, max: 1.1, noNaN: true }), { freq: 2 }),
        ruleArb,
        profileArb,
        fc.subarray(MARKET_IDS),
        fc.oneof(
          fc.record({ kind: fc.constant("value" as const), value: finite(-1e6, 1e6) }),
          fc.record({ kind: fc.constant("below" as const), limit: fc.option(finite(0, 1e5)) }),
          fc.record({ kind: fc.constant("above" as const), limit: finite(0, 1e5) }),
          fc.record({ kind: fc.constant("presence" as const), present: fc.boolean() }),
        ),
        fc.nat(),
        fc.option(fc.record({ kind: fc.constantFrom("expanded" as const, "standard" as const), value: finite(0, 100) })),
        fc.boolean(),
        (p, lower, width, targetShare, rule, profile, markets, numericReading, pick, uncertainty, foreignUnit) => {
          // Ranges are mostly well-formed, with a few inverted or out-of-range targets for the schema to refuse.
          const upper = width === null ? null : (lower ?? 0) + width;
          const target = targetShare === null || upper === null ? null : (lower ?? 0) + targetShare * (upper - (lower ?? 0));
          const reading = p.kind === "presence" && !foreignUnit ? { kind: "presence" as const, present: pick % 2 === 0 } : numericReading;
          // Mostly a unit the parameter accepts; sometimes any unit, which the schema must then reject.
          const unit = foreignUnit ? unitIds[pick % unitIds.length]! : (p.units[pick % p.units.length] as UnitId);
          const row = { parameter: p.id, unit: p.unit, lower, upper, target, rule };
          const input = { reading, unit, uncertainty };
          if (!buyerRequirementSchema.safeParse(row).success || !wineProfileSchema.safeParse(profile).success) return true;
          if (!resultForParameterSchema(p.id).safeParse(input).success) return true;
          exercised += 1;
          const req = buildRequirement(row, markets, profile);
          const v = evaluate(req, input);
          return typeof v.outcome === "string" && typeof v.explanation === "string";
        },
      ),
      { seed: 20261202, numRuns: 3000 },
    );
    expect(exercised).toBeGreaterThan(300);
  });

  it("when results come in any unit the parameter accepts, against market law for any wine, with or without an uncertainty, then the batch path and the full verdict agree", () => {
    const markets = ["EU", "GB", "OIV", "US", "AU-NZ"] as const;
    fc.assert(
      fc.property(
        fc.constantFrom(...quantityParams),
        fc.nat(),
        profileArb,
        finite(0, 50),
        finite(0.1, 200),
        ruleArb,
        fc.array(fc.tuple(finite(0, 300), fc.option(finite(0, 5))), { minLength: 1, maxLength: 20 }),
        (p, pick, profile, lower, width, rule, results) => {
          const inputUnit = p.units[pick % p.units.length]!;
          const req = buildRequirement(
            { parameter: p.id, unit: p.unit, lower: p.bounds === "upper" ? null : lower, upper: lower + width, rule },
            markets,
            profile,
          );
          const out = new Uint8Array(results.length);
          evaluateMany(
            compileRequirement(req, inputUnit),
            results.map((r) => r[0]),
            results.map((r) => r[1] ?? NaN),
            out,
          );
          return results.every(([x, u], i) => {
            const v = evaluate(req, {
              reading: { kind: "value", value: x },
              unit: inputUnit,
              uncertainty: u === null ? null : { kind: "standard", value: u },
            });
            return v.outcome === STATEMENT_CODES[out[i]!];
          });
        },
      ),
      SEED,
    );
  });

  it("when the batch path and the full verdict see the same numeric results, then they give the same statements", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...quantityParams),
        finite(0, 50),
        finite(0.1, 200),
        ruleArb,
        fc.array(fc.tuple(finite(0, 300), fc.option(finite(0, 5))), { minLength: 1, maxLength: 30 }),
        (p, lower, width, rule, results) => {
          const req = buildRequirement(
            { parameter: p.id, unit: p.unit, lower: p.bounds === "upper" ? null : lower, upper: lower + width, rule },
            [],
            { colour: "red", category: "still" },
          );
          const out = new Uint8Array(results.length);
          evaluateMany(
            compileRequirement(req, p.unit),
            results.map((r) => r[0]),
            results.map((r) => r[1] ?? NaN),
            out,
          );
          return results.every(([x, u], i) => {
            const v = evaluate(req, {
              reading: { kind: "value", value: x },
              unit: p.unit,
              uncertainty: u === null ? null : { kind: "standard", value: u },
            });
            return v.outcome === STATEMENT_CODES[out[i]!];
          });
        },
      ),
      SEED,
    );
  });
});
