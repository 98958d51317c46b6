/** Schemas for ordering audits, laboratory price lists and laboratory results, shared by forms and API. */
import { z } from "zod";
import { pageQuery } from "../paging.ts";
import { PARAMETERS } from "../engine/index.ts";
import { ANALYSIS_STAGES } from "../lots/vocabulary.ts";
import { ORDER_STATUSES } from "./vocabulary.ts";
import { idempotencyKeySchema, isoDate, resultEntrySchema } from "../lots/schemas.ts";

const parameterIds = PARAMETERS.filter((p) => !("derivedFrom" in p && p.derivedFrom)).map((p) => p.id) as [string, ...string[]];

export const AUDIT_MAX_LOTS = 20;

export const newAuditOrderSchema = z.object({
  idempotencyKey: idempotencyKeySchema,
  contractId: z.number({ error: "Choose the contract." }).int().positive({ error: "Choose the contract." }),
  laboratoryOrgId: z.number({ error: "Choose the laboratory." }).int().positive({ error: "Choose the laboratory." }),
  lotIds: z
    .array(z.number().int().positive())
    .min(1, { error: "Choose at least one lot." })
    .max(AUDIT_MAX_LOTS, { error: `One order covers at most ${AUDIT_MAX_LOTS} lots.` })
    .refine((ids) => new Set(ids).size === ids.length, { error: "A lot is listed twice." }),
  parameters: z
    .array(z.enum(parameterIds, { error: "Unknown parameter." }))
    .min(1, { error: "Choose at least one parameter." })
    .max(40)
    .refine((ps) => new Set(ps).size === ps.length, { error: "A parameter is listed twice." }),
  stage: z.enum(ANALYSIS_STAGES, { error: "Choose the stage the producer's results are compared at." }),
  note: z.string().trim().max(1000).nullish(),
});
export type NewAuditOrder = z.infer<typeof newAuditOrderSchema>;

export const priceListSchema = z.object({
  items: z
    .array(
      z.object({
        parameter: z.enum(parameterIds, { error: "Unknown parameter." }),
        priceCents: z
          .number({ error: "Enter a price." })
          .int({ error: "Prices are in whole cents." })
          .min(100, { error: "A price is at least 1.00." })
          .max(1_000_000, { error: "A price is at most 10,000.00." }),
      }),
    )
    .max(60)
    .refine((items) => new Set(items.map((i) => i.parameter)).size === items.length, { error: "A parameter is priced twice." }),
});
export type PriceListInput = z.infer<typeof priceListSchema>;

export const labResultsSchema = z.object({
  idempotencyKey: idempotencyKeySchema,
  sampleDate: isoDate,
  accreditation: z.string().trim().max(60).nullish(),
  reportReference: z.string().trim().max(80).nullish(),
  lots: z
    .array(
      z.object({
        lotId: z.number().int().positive(),
        results: z.array(resultEntrySchema).min(1, { error: "Enter at least one result." }).max(40),
      }),
    )
    .min(1)
    .max(AUDIT_MAX_LOTS),
});
export type LabResultsInput = z.infer<typeof labResultsSchema>;

export const auditListQuerySchema = z.object({
  ...pageQuery,
  status: z.enum(ORDER_STATUSES).optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
});
