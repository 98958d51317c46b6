/**
 * Cellarpact's comparison engine: the one public module. Pure functions over plain data; no I/O,
 * no clock. Client and server import from here only (lint enforces it), so both give the same answer.
 *
 * @example
 * const req = buildRequirement({ parameter: "volatile_acidity", unit: "g/L as acetic acid", upper: 0.9,
 *   rule: DEFAULT_DECISION_RULE }, ["EU"], { colour: "red", category: "still", sugarGPerL: 2 });
 * const verdict = evaluate(req, { reading: { kind: "value", value: 0.82 }, unit: "g/L as acetic acid" });
 */

/** Units, conversions and branded quantity types. */
export { UNITS, ETHANOL_DENSITY_G_PER_ML, UnitError, convert, isUnit, quantity } from "./units.ts";
export type { UnitId, Dimension, Quantity, MgPerL, GPerL, MeqPerL, PercentVol, PH } from "./units.ts";

/** Laboratory notation: decimal commas or points, thousands groups, "<0.5", "≤ 0.5", "< LOQ (0.5)", "n.d.", "n.q.", "tr.", "> 300", "0.82 ± 0.05", a trailing unit. */
export { parseReading, parseDecimal, readNumber, formatReading } from "./parse.ts";
export type { Reading, ParseResult, ParseOptions, NumberFormat } from "./parse.ts";

/** Display rounding: every value shown to its parameter's precision in the unit shown. */
export { displayDigits, displayValue, unitLabel } from "./display.ts";

/** The parameter catalogue. */
export { PARAMETERS, parameter, findParameter, isParameterId, acceptsUnit } from "./parameters.ts";
export type { ParameterDef, ParameterId, ParameterGroup, MethodRef, DefaultUncertainty, BoundSides } from "./parameters.ts";

/** Plausible ranges: results that almost certainly mean a wrong unit. */
export { PLAUSIBLE_RANGES, implausibility } from "./plausibility.ts";

/** Derived values. */
export {
  DEFAULT_SO2_PKA,
  SUGAR_PER_PERCENT_VOL,
  boundSo2,
  molecularSo2,
  freeSo2ForMolecular,
  sugarFreeExtract,
  reducedExtract,
  fixedAcidity,
  potentialAlcohol,
  totalAlcohol,
  oechsleFromDensity,
  baumeFromDensity,
  brixFromDensity,
} from "./derived.ts";

/** Replicates: averaged only within the method's repeatability (ISO 5725-6 critical range). */
export { checkReplicates } from "./replicates.ts";
export type { ReplicateCheck } from "./replicates.ts";

/** What a guard band costs: global consumer's and producer's risks (JCGM 106:2012, clause 9). */
export { globalRisks } from "./risk.ts";
export type { GlobalRisks, RiskInput } from "./risk.ts";

/** Labelling: EU sugar terms, alcohol tolerances (EU, US with tax class), sulphite statement. */
export {
  euStillSugarTerms,
  euSparklingSugarTerms,
  euSugarLabelTolerance,
  euAlcoholLabelCheck,
  usAlcoholLabelCheck,
  usTaxClass,
  sulphiteStatement,
} from "./labelling.ts";
export type {
  Citation,
  WineCategory,
  StillSugarTerm,
  SparklingSugarTerm,
  SugarTermResult,
  AlcoholCheck,
  SulphiteTrigger,
  SulphiteMarket,
} from "./labelling.ts";

/** Market rule packs: which limits apply to this wine in this market, and why. */
export {
  MARKET_PACKS,
  MARKET_IDS,
  MarketError,
  applicableLimits,
  citationConfirmed,
  unconfirmedReason,
  undeterminedText,
} from "./markets/index.ts";
export type { AppliedLimit, UndeterminedLimit, MarketId, MarketPack, WineProfile } from "./markets/index.ts";
export type { Colour, LegalLimitRule, Applicability, OivSulphateCase } from "./markets/types.ts";
export { PROFILE_FACT_LABELS, OIV_SULPHATE_CASES } from "./markets/types.ts";
export { retainedInGb } from "./markets/gb.ts";

/** Decision rules (ISO/IEC 17025 7.8.6, ILAC-G8) and conformance probability (JCGM 106). */
export { DEFAULT_DECISION_RULE, conformanceProbability, describeRule, guardWidth, ruleLabel, statementForSide } from "./decision.ts";
export type { DecisionRule, GuardBand, Statement } from "./decision.ts";
export { normalCdf, erfc } from "./normal.ts";

/** Requirements: buyer range ∩ market law, with the governing bound and its source. */
export { buildRequirement, validateBuyerRequirement, RequirementError } from "./requirement.ts";
export type { BuyerRequirement, GoverningRequirement, GoverningBound, BoundSource, RequirementIssue } from "./requirement.ts";

/** Verdicts for one result. */
export { ENGINE_VERSION, evaluate, guardLeavesNothing, usedUncertainty } from "./evaluate.ts";
export type { Verdict, Outcome, ResultInput, ReportedUncertainty, UsedUncertainty } from "./evaluate.ts";

/** Transit: arrival against pre-shipment. */
export { DEFAULT_DRIFT_ALLOWANCES, compareTransit } from "./transit.ts";
export type { DriftAllowance, TransitFinding, TransitValue } from "./transit.ts";

/** Consistency over lots and vintages. */
export { D2, E2, D4, individualsChart, ewmaChart, westernElectricSignals, capability, driftWarning } from "./consistency.ts";
export type { IndividualsChart, EwmaPoint, RuleSignal, Capability, DriftWarning } from "./consistency.ts";

/** Producer vs independent laboratory (ISO 13528 scores). */
export { enNumber, zScore, zetaScore, compareWithReference } from "./lab-comparison.ts";
export type { ScoreReading, ComparedResult, ComparisonOutcome, ResultComparison } from "./lab-comparison.ts";

/** Spec versions: diff and backtest. */
export { diffSpecs, backtest, backtestSteps } from "./spec-compare.ts";
export type { ParameterDiff, SideChange, DiffKind, PastResult, BacktestChange, BacktestSummary } from "./spec-compare.ts";

/** zod schemas for the plain-data inputs above. */
export {
  buyerRequirementSchema,
  decisionRuleSchema,
  guardBandSchema,
  wineProfileSchema,
  readingSchema,
  resultInputSchema,
  resultForParameterSchema,
} from "./schemas.ts";

/** Fast path for large volumes: compiled requirements over columns of values. */
export { STATEMENT_CODES, compileRequirement, evaluateMany } from "./batch.ts";
export type { CompiledRequirement } from "./batch.ts";
