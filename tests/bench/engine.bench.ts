/**
 * 10,000 lots × 40 requirements: the engine against a bare loop doing only the numeric comparisons,
 * side by side in one process, on the same columns of data. Prints the ratios (goal: within 3×).
 */
import {
  buildRequirement,
  compileRequirement,
  DEFAULT_DECISION_RULE,
  evaluate,
  evaluateMany,
  PARAMETERS,
  STATEMENT_CODES,
  type GoverningRequirement,
} from "../../shared/engine/index.ts";

const LOTS = 10_000;
const params = PARAMETERS.filter((p) => p.kind === "quantity").slice(0, 40);
while (params.length < 40) params.push(params[params.length % 30]!);

// Deterministic pseudo-random results (LCG) so every loop sees the same data.
let seed = 42;
const rand = () => (seed = (seed * 1664525 + 1013904223) >>> 0) / 2 ** 32;

const requirements: GoverningRequirement[] = params.map((p) =>
  buildRequirement(
    { parameter: p.id, unit: p.unit, lower: p.bounds === "upper" ? null : 1, upper: 100, rule: DEFAULT_DECISION_RULE },
    ["EU", "US"],
    {
      colour: "red",
      category: "still",
      sugarGPerL: 2,
      harvestYear: 2024,
      alcoholPercentVol: 13,
    },
  ),
);
const values = requirements.map(() => Float64Array.from({ length: LOTS }, () => rand() * 120));
const uncertainties = requirements.map(() => Float64Array.from({ length: LOTS }, () => rand() * 2));
const limits = requirements.map((r) => ({ lower: r.lower?.value ?? -Infinity, upper: r.upper?.value ?? Infinity }));
const compiled = requirements.map((r, i) => compileRequirement(r, params[i]!.unit));
const out = new Uint8Array(LOTS);

function bareLoop(): number {
  let notPass = 0;
  for (let r = 0; r < requirements.length; r++) {
    const { lower, upper } = limits[r]!;
    const xs = values[r]!;
    const us = uncertainties[r]!;
    for (let i = 0; i < LOTS; i++) {
      const w = 2 * us[i]!;
      if (xs[i]! > upper - w || xs[i]! < lower + w) notPass++;
    }
  }
  return notPass;
}

function batchEngine(): number {
  let notPass = 0;
  for (let r = 0; r < requirements.length; r++) {
    notPass += evaluateMany(compiled[r]!, values[r]!, uncertainties[r]!, out);
  }
  return notPass;
}

function fullVerdicts(sampleLots: number): number {
  let notPass = 0;
  for (let r = 0; r < requirements.length; r++) {
    for (let i = 0; i < sampleLots; i++) {
      const v = evaluate(requirements[r]!, {
        reading: { kind: "value", value: values[r]![i]! },
        unit: params[r]!.unit,
        uncertainty: { kind: "standard", value: uncertainties[r]![i]! },
      });
      if (v.outcome !== STATEMENT_CODES[0]) notPass++;
    }
  }
  return notPass;
}

const time = (fn: () => number) => {
  const t = performance.now();
  const result = fn();
  return { ms: performance.now() - t, result };
};

bareLoop();
batchEngine();
const runs = { bare: [] as number[], batch: [] as number[] };
let agree = true;
for (let round = 0; round < 5; round++) {
  const b = time(bareLoop);
  const e = time(batchEngine);
  runs.bare.push(b.ms);
  runs.batch.push(e.ms);
  agree &&= b.result === e.result;
}
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const SAMPLE = 1000;
const full = time(() => fullVerdicts(SAMPLE));
const fullPerResult = full.ms / (SAMPLE * requirements.length);
const barePerResult = median(runs.bare) / (LOTS * requirements.length);

console.log(`engine benchmark: ${LOTS} lots × ${requirements.length} requirements = ${LOTS * requirements.length} results`);
console.log(`  bare comparisons      ${median(runs.bare).toFixed(1)} ms`);
console.log(
  `  evaluateMany (batch)  ${median(runs.batch).toFixed(1)} ms   ratio ${(median(runs.batch) / median(runs.bare)).toFixed(2)}× (goal ≤ 3×), same counts: ${agree}`,
);
console.log(
  `  evaluate (full verdict with explanation, ${SAMPLE} lots sampled)  ${(fullPerResult * 1e6).toFixed(0)} ns/result   ratio ${(fullPerResult / barePerResult).toFixed(0)}×`,
);
