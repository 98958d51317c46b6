/** Lot and analysis schemas shared by the forms, the CSV import and the API. */
import { z } from "zod";
import { pageQuery } from "../paging.ts";
import { countQuery } from "../count-query.ts";
import { findParameter, MARKET_IDS, parseReading, PARAMETERS, UNITS, type MarketId, type UnitId } from "../engine/index.ts";
import { ANALYSIS_STAGES, CONTAINERS } from "./vocabulary.ts";

const parameterIds = PARAMETERS.map((p) => p.id) as [string, ...string[]];
const unitIds = Object.keys(UNITS) as [UnitId, ...UnitId[]];
export const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Use a date like 2026-03-31." });
export const lotCodeSchema = z
  .string()
  .trim()
  .min(1, { error: "Give the lot code." })
  .max(60, { error: "A lot code has at most 60 characters." })
  .regex(/^[A-Za-z0-9._/-]+$/, { error: "A lot code uses letters, digits and . _ / - only." });

export const lotSchema = z.object({
  contractId: z.number().int().positive({ error: "Choose the contract." }),
  vintage: z.number({ error: "Enter the vintage." }).int().min(1950, { error: "Enter a vintage from 1950." }).max(2100),
  lotCode: lotCodeSchema,
  volumeLitres: z
    .number({ error: "Enter the volume." })
    .positive({ error: "The volume must be above 0." })
    .max(10_000_000, { error: "The volume is too large." }),
  container: z.enum(CONTAINERS, { error: "Choose the container." }),
  plannedDate: isoDate.nullish(),
  market: z.enum(MARKET_IDS as [MarketId, ...MarketId[]], { error: "Choose the destination market." }),
  // The label states whole or half units in the EU; the label check says so rather than refusing other values here.
  labelledAlcoholPercentVol: z
    .number({ error: "Enter the labelled alcohol as a number." })
    .min(0.5, { error: "Enter the labelled alcohol in % vol." })
    .max(25, { error: "A wine's label states at most 25 % vol." })
    .nullish(),
});
export type LotInput = z.infer<typeof lotSchema>;

export const uncertaintySchema = z.object({
  kind: z.enum(["expanded", "standard", "relative"]),
  value: z.number({ error: "Enter the uncertainty as a number." }).min(0, { error: "An uncertainty cannot be negative." }),
  k: z.number().gt(0, { error: "A coverage factor k must be above 0." }).lte(5, { error: "A coverage factor k is at most 5." }).optional(),
});

/** One result as typed or imported: the laboratory's text is kept, and read by the engine. */
export const resultEntrySchema = z
  .object({
    parameter: z.enum(parameterIds, { error: "Unknown parameter." }),
    raw: z.string().trim().min(1, { error: "Enter the result." }).max(40, { error: "A result has at most 40 characters." }),
    unit: z.enum(unitIds, { error: "Unknown unit." }),
    uncertainty: uncertaintySchema.nullish(),
    method: z.string().trim().max(120).nullish(),
  })
  .superRefine((r, ctx) => {
    const p = findParameter(r.parameter);
    if (!p) return;
    if (!(p.units as readonly string[]).includes(r.unit))
      ctx.addIssue({ code: "custom", path: ["unit"], message: `${r.unit} is not a unit for ${p.name}.` });
    const parsed = parseReading(r.raw, { presence: p.kind === "presence", unit: r.unit });
    if (!parsed.ok) ctx.addIssue({ code: "custom", path: ["raw"], message: parsed.error });
    else if (parsed.uncertainty && r.uncertainty)
      ctx.addIssue({
        code: "custom",
        path: ["raw"],
        message: `"${r.raw}" carries its own uncertainty; give it there or in the uncertainty field, not both.`,
      });
  });
export type ResultEntry = z.infer<typeof resultEntrySchema>;

const uniqueParameters = (results: { parameter: string }[], ctx: z.RefinementCtx) => {
  const seen = new Set<string>();
  results.forEach((r, i) => {
    if (seen.has(r.parameter))
      ctx.addIssue({ code: "custom", path: ["results", i, "parameter"], message: "This parameter appears twice in one analysis." });
    seen.add(r.parameter);
  });
};

/** How a laboratory writes numbers: "point" for 1,234.5, "comma" for 1.234,5. */
export const NUMBER_FORMATS = ["point", "comma"] as const;
export const NUMBER_FORMAT_LABELS: Record<(typeof NUMBER_FORMATS)[number], string> = {
  point: "1,234.5 (point for decimals)",
  comma: "1.234,5 (comma for decimals)",
};

const analysisHeader = {
  stage: z.enum(ANALYSIS_STAGES, { error: "Choose the stage." }),
  laboratoryName: z.string().trim().min(2, { error: "Name the laboratory." }).max(160),
  accreditation: z.string().trim().max(60).nullish(),
  numberFormat: z.enum(NUMBER_FORMATS, { error: "Choose how the laboratory writes numbers." }).nullish(),
};

export const idempotencyKeySchema = z
  .string()
  .regex(/^[A-Za-z0-9_-]{8,100}$/, { error: "An idempotency key has 8–100 letters, digits, _ or -." });

export const analysisSubmissionSchema = z
  .object({
    idempotencyKey: idempotencyKeySchema,
    ...analysisHeader,
    sampleDate: isoDate,
    results: z.array(resultEntrySchema).min(1, { error: "Enter at least one result." }).max(80),
  })
  .superRefine((a, ctx) => uniqueParameters(a.results, ctx));
export type AnalysisSubmission = z.infer<typeof analysisSubmissionSchema>;

export const importSampleSchema = z
  .object({
    lotCode: lotCodeSchema,
    vintage: z.number().int().min(1950).max(2100).nullish(),
    sampleDate: isoDate,
    results: z.array(resultEntrySchema).min(1).max(80),
  })
  .superRefine((s, ctx) => uniqueParameters(s.results, ctx));

export const IMPORT_BATCH_MAX = 2000;
export const importBatchSchema = z.object({
  idempotencyKey: idempotencyKeySchema,
  ...analysisHeader,
  market: z.enum(MARKET_IDS as [MarketId, ...MarketId[]]).nullish(),
  samples: z.array(importSampleSchema).min(1, { error: "The file has no sample to import." }).max(IMPORT_BATCH_MAX),
});
export type ImportBatch = z.infer<typeof importBatchSchema>;

/** What a producer may correct on a registered lot; contract, vintage and code stay fixed. */
export const lotUpdateSchema = lotSchema.pick({
  volumeLitres: true,
  container: true,
  plannedDate: true,
  market: true,
  labelledAlcoholPercentVol: true,
});
export type LotUpdate = z.infer<typeof lotUpdateSchema>;

/** The lots list: a page of lots, newest vintage first, optionally of one contract or matching a lot code. */
export const lotListQuerySchema = z.object({
  ...pageQuery,
  contract: z.coerce.number().int().positive().optional(),
  q: z.string().trim().max(60).optional(),
});
export type LotListQuery = z.infer<typeof lotListQuerySchema>;

export const READINESS_HORIZON_DEFAULT = 120;
export const READINESS_HORIZON_MAX = 730;
/** The readiness board: lots due within the horizon (days from today), soonest first, undated ones last. */
export const readinessQuerySchema = z.object({
  ...pageQuery,
  horizon: countQuery({
    fallback: READINESS_HORIZON_DEFAULT,
    min: 1,
    max: READINESS_HORIZON_MAX,
    notWhole: "The horizon is a whole number of days.",
    tooFew: "The horizon is at least 1 day.",
    tooMany: `The horizon is at most ${READINESS_HORIZON_MAX} days.`,
  }),
});
export type ReadinessQuery = z.infer<typeof readinessQuerySchema>;

export const TREND_VINTAGES_DEFAULT = 3;
export const TREND_VINTAGES_MAX = 10;
/** A trend: one parameter over the contract's latest vintages. */
export const trendQuerySchema = z.object({
  parameter: z.enum(PARAMETERS.map((p) => p.id) as [string, ...string[]], { error: "Choose a parameter." }),
  vintages: countQuery({
    fallback: TREND_VINTAGES_DEFAULT,
    min: 1,
    max: TREND_VINTAGES_MAX,
    notWhole: "Say how many vintages, as a whole number.",
    tooFew: "Show at least 1 vintage.",
    tooMany: `Show at most ${TREND_VINTAGES_MAX} vintages.`,
  }),
});
export type TrendQuery = z.infer<typeof trendQuerySchema>;
