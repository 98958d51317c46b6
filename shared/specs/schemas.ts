/**
 * Spec-sheet schemas shared by the editor and the API, so both give the same message for the same
 * mistake. Row checks come from the engine (validateBuyerRequirement), never re-implemented here.
 */
import { z } from "zod";
import { wineLawFactsSchema } from "./law-facts.ts";
import { countQuery } from "../count-query.ts";
import { pageQuery } from "../paging.ts";
import { buyerRequirementSchema, isParameterId, MARKET_IDS, type MarketId } from "../engine/index.ts";
import { SEVERITIES, STAGES, SPEC_STATUSES, WINE_CATEGORIES, COLOURS } from "./vocabulary.ts";

export const specRowSchema = buyerRequirementSchema.and(
  z.object({
    method: z.string().trim().max(120, { error: "A method reference has at most 120 characters." }).nullish(),
    severity: z.enum(SEVERITIES, { error: "Choose a severity." }),
    stages: z.array(z.enum(STAGES)).min(1, { error: "Choose at least one stage at which the result is required." }),
  }),
);
export type SpecRowInput = z.infer<typeof specRowSchema>;

const year = z
  .number({ error: "Enter a year." })
  .int({ error: "Enter a whole year." })
  .min(1950, { error: "Enter a year from 1950." })
  .max(2100, { error: "Enter a year up to 2100." });

export const specDraftSchema = z
  .object({
    lockVersion: z.number().int().min(0),
    title: z.string().trim().max(160, { error: "A title has at most 160 characters." }).nullish(),
    vintageFrom: year,
    vintageTo: year.nullish(),
    stages: z.array(z.enum(STAGES)).min(1, { error: "Choose at least one stage this version covers." }),
    rows: z.array(specRowSchema).max(80, { error: "A version has at most 80 requirements." }),
  })
  .superRefine((d, ctx) => {
    if (d.vintageTo != null && d.vintageTo < d.vintageFrom) {
      ctx.addIssue({ code: "custom", path: ["vintageTo"], message: "The last vintage comes before the first." });
    }
    const seen = new Set<string>();
    d.rows.forEach((row, i) => {
      if (seen.has(row.parameter))
        ctx.addIssue({ code: "custom", path: ["rows", i, "parameter"], message: "This parameter is already in the sheet." });
      seen.add(row.parameter);
      row.stages.forEach((s) => {
        if (!d.stages.includes(s))
          ctx.addIssue({ code: "custom", path: ["rows", i, "stages"], message: "A row can only require stages this version covers." });
      });
    });
  });
export type SpecDraftInput = z.infer<typeof specDraftSchema>;

export const newVersionSchema = z.discriminatedUnion("from", [
  z.object({ from: z.literal("blank") }),
  z.object({ from: z.literal("template"), templateId: z.string().min(1, { error: "Choose a template." }) }),
  z.object({ from: z.literal("version"), versionId: z.number().int().positive() }),
]);
export type NewVersionInput = z.infer<typeof newVersionSchema>;

export const commentSchema = z.object({
  requirementId: z.number().int().positive().nullish(),
  body: z.string().trim().min(1, { error: "Write a comment." }).max(2000, { error: "A comment has at most 2000 characters." }),
});
export type CommentInput = z.infer<typeof commentSchema>;

export const requestChangesSchema = z.object({
  reason: z.string().trim().min(3, { error: "Say what should change." }).max(2000, { error: "At most 2000 characters." }),
});

export const specListQuerySchema = z.object({
  ...pageQuery,
  wine: z.coerce.number().int().positive().optional(),
  producer: z.coerce.number().int().positive().optional(),
  market: z.enum(MARKET_IDS as [MarketId, ...MarketId[]]).optional(),
  status: z.enum(SPEC_STATUSES).optional(),
  q: z.string().trim().max(100).optional(),
});

export const wineSchema = z.object({
  name: z.string().trim().min(2, { error: "Use at least 2 characters." }).max(160, { error: "At most 160 characters." }),
  colour: z.enum(COLOURS, { error: "Choose a colour." }),
  category: z.enum(WINE_CATEGORIES, { error: "Choose a style." }),
  region: z.string().trim().min(2, { error: "Name the region." }).max(120),
  markets: z.array(z.enum(MARKET_IDS as [MarketId, ...MarketId[]])).min(1, { error: "Choose at least one destination market." }),
  nominalSugarGPerL: z.number().min(0).max(600).nullish(),
  nominalAlcoholPercentVol: z.number().min(0).max(25).nullish(),
  lawFacts: wineLawFactsSchema.optional(),
});

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Use a date like 2026-03-31." });

export const newContractSchema = z
  .object({
    reference: z
      .string()
      .trim()
      .min(3, { error: "Use at least 3 characters." })
      .max(40, { error: "At most 40 characters." })
      .regex(/^[A-Za-z0-9._/-]+$/, { error: "Use letters, digits and . _ / - only." }),
    producerOrgId: z.number({ error: "Choose the producer." }).int().positive({ error: "Choose the producer." }),
    startsOn: isoDate,
    endsOn: isoDate.nullish(),
    wine: wineSchema,
  })
  .refine((c) => !c.endsOn || c.endsOn >= c.startsOn, { path: ["endsOn"], error: "The contract cannot end before it starts." });
export type NewContractInput = z.infer<typeof newContractSchema>;

export const BACKTEST_LOTS_DEFAULT = 200;
export const BACKTEST_LOTS_MAX = 2000;
/** Past results are read over a window: the contract's last `lots` lots, and only the parameters the two versions name. */
export const backtestQuerySchema = z.object({
  lots: countQuery({
    fallback: BACKTEST_LOTS_DEFAULT,
    min: 1,
    max: BACKTEST_LOTS_MAX,
    notWhole: "The window is a whole number of lots.",
    tooFew: "The window holds at least 1 lot.",
    tooMany: `The window holds at most ${BACKTEST_LOTS_MAX} lots.`,
  }),
  parameters: z
    .string({ error: "Name the parameters, separated by commas." })
    .min(1, { error: "Name at least one parameter." })
    .max(4000)
    .transform((v, ctx) => {
      const ids = [...new Set(v.split(",").map((p) => p.trim()))];
      const unknown = ids.filter((p) => !isParameterId(p));
      if (unknown.length) ctx.addIssue({ code: "custom", message: `Unknown parameter: ${unknown.join(", ")}.` });
      return ids;
    }),
});
export type BacktestQuery = z.infer<typeof backtestQuerySchema>;
