import { z } from "zod";
import { pageQuery } from "../paging.ts";
import { CONDITION_KINDS, DEVIATION_OUTCOMES, DEVIATION_STATUSES, NOTIFICATION_KINDS } from "./vocabulary.ts";

const body = z.string().trim().min(1, { error: "Write something." }).max(5000, { error: "A message has at most 5,000 characters." });

export const conditionSchema = z.object({
  kind: z.enum(CONDITION_KINDS, { error: "Choose the kind of condition." }),
  detail: z.string().trim().min(3, { error: "Say what the condition is." }).max(500),
});

export const proposalSchema = z.object({
  outcome: z.enum(DEVIATION_OUTCOMES, { error: "Choose an outcome." }),
  conditions: z.array(conditionSchema).max(10).default([]),
});

export const quoteSchema = z.object({ analysisId: z.number().int().positive(), parameter: z.string().min(1).max(40) });

export const messageSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("comment"), parentId: z.number().int().positive().nullish(), body, quote: quoteSchema.nullish() }),
  z.object({
    kind: z.literal("proposal"),
    parentId: z.number().int().positive().nullish(),
    body,
    proposal: proposalSchema,
    quote: quoteSchema.nullish(),
  }),
  z.object({ kind: z.literal("acceptance"), parentId: z.number({ error: "Say which proposal you accept." }).int().positive(), body }),
]);
export type MessageInput = z.infer<typeof messageSchema>;

export const editMessageSchema = z.object({ body });

export const decisionSchema = proposalSchema.extend({
  reason: z.string().trim().min(10, { error: "Give the reason for the decision (at least 10 characters)." }).max(5000),
});
export type DecisionInput = z.infer<typeof decisionSchema>;

export const manualDeviationSchema = z.object({
  lotId: z.number().int().positive(),
  parameters: z.array(z.string().min(1).max(40)).max(40).default([]),
  reason: z.string().trim().min(10, { error: "Say why this deviation is opened (at least 10 characters)." }).max(2000),
});

export const deviationListQuerySchema = z.object({
  ...pageQuery,
  status: z.enum(DEVIATION_STATUSES).optional(),
  lot: z.coerce.number().int().positive().optional(),
  contract: z.coerce.number().int().positive().optional(),
  overdue: z.enum(["true", "false"]).optional(),
});
export type DeviationListQuery = z.infer<typeof deviationListQuerySchema>;

export const preferencesSchema = z.object({
  emailMode: z.enum(["immediate", "daily_digest", "off"]),
  kinds: z.array(z.enum(NOTIFICATION_KINDS)).max(NOTIFICATION_KINDS.length),
});
