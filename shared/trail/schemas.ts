/** Filters for reading an organisation's trail. */
import { z } from "zod";

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Use a date like 2026-03-31." });

export const trailQuerySchema = z.object({
  action: z.string().trim().max(80).optional(),
  entityType: z.string().trim().max(40).optional(),
  entityId: z.string().trim().max(64).optional(),
  actor: z.coerce.number().int().positive().optional(),
  from: day.optional(),
  to: day.optional(),
  limit: z.coerce.number().int().min(1).max(5000).default(200),
  format: z.enum(["json", "csv"]).optional(),
});
