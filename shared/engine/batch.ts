/**
 * Fast path for large volumes (backtests, trends, imports): a requirement compiled to plain numbers,
 * then evaluated over columns of values. Gives the same statements as evaluate() for numeric results;
 * explanations and probabilities are left to evaluate() for the results someone looks at.
 */
import type { Statement } from "./decision.ts";
import type { GoverningRequirement } from "./requirement.ts";
import { parameter } from "./parameters.ts";
import { convert, type UnitId } from "./units.ts";

/** Index = code returned by evaluateMany. */
export const STATEMENT_CODES: readonly Statement[] = ["pass", "conditional pass", "conditional fail", "fail"];

export interface CompiledRequirement {
  lower: number;
  upper: number;
  /** 0 simple, 1 guarded, 2 non-binary. */
  rule: 0 | 1 | 2;
  k: number;
  /** Default standard uncertainty when none is given: absolute part + relative part × |x|. */
  defaultAbs: number;
  defaultRel: number;
  /** Every unit conversion in the engine is proportional, so one factor converts input to canonical. */
  factor: number;
}

export function compileRequirement(
  req: GoverningRequirement,
  inputUnit: UnitId,
  opts: { densityGPerMl?: number } = {},
): CompiledRequirement {
  const def = parameter(req.parameter);
  const d = "defaultUncertainty" in def ? def.defaultUncertainty : undefined;
  return {
    lower: req.lower?.value ?? -Infinity,
    upper: req.upper?.value ?? Infinity,
    rule: req.rule.kind === "simple" ? 0 : req.rule.kind === "guarded" ? 1 : 2,
    k: req.rule.kind === "simple" ? 0 : req.rule.guard.k,
    defaultAbs: d?.kind === "absolute" ? d.u : 0,
    defaultRel: d?.kind === "relative" ? d.u : 0,
    factor: convert(1, inputUnit, req.unit, opts),
  };
}

/**
 * Writes the statement code of each numeric result of one requirement into out, and returns how
 * many results are not a plain pass. standardUncertainties (same unit as the values) may be null,
 * or hold NaN where a result has none; the parameter's default is used there.
 */
export function evaluateMany(
  c: CompiledRequirement,
  values: ArrayLike<number>,
  standardUncertainties: ArrayLike<number> | null,
  out: Uint8Array,
): number {
  const { lower, upper, rule, k, defaultAbs, defaultRel, factor } = c;
  const n = values.length;
  const nonBinary = rule === 2;
  let notPassing = 0;
  for (let i = 0; i < n; i++) {
    const x = values[i]! * factor;
    const given = standardUncertainties === null ? NaN : standardUncertainties[i]!;
    // NaN marks "no uncertainty given": fall back to the parameter's default.
    const w = given === given ? k * factor * Math.abs(given) : k * (defaultAbs + defaultRel * Math.abs(x));
    // Distance inside the nearer limit decides; the limit value itself conforms.
    const d = Math.min(upper - x, x - lower);
    const code = d >= w ? 0 : !nonBinary ? 3 : d >= 0 ? 1 : d >= -w ? 2 : 3;
    out[i] = code;
    notPassing += code === 0 ? 0 : 1;
  }
  return notPassing;
}
