/** Filters for reading an organisation's trail. */
import { z } from "zod";
import { pageQuery } from "../paging.ts";

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: "Use a date like 2026-03-31." });

export const trailQuerySchema = z.object({
  action: z.string().trim().max(80).optional(),
  entityType: z.string().trim().max(40).optional(),
  entityId: z.string().trim().max(64).optional(),
  actor: z.coerce.number().int().positive().optional(),
  from: day.optional(),
  to: day.optional(),
  ...pageQuery,
  /** A download (csv or json) holds every matching entry up to TRAIL_EXPORT_MAX, newest first; without it the answer is one page. */
  format: z.enum(["json", "csv"]).optional(),
});

export const TRAIL_EXPORT_MAX = 10_000;
export type TrailQuery = z.infer<typeof trailQuerySchema>;

const position = (what: string) =>
  z.coerce
    .number({ error: `Give ${what} as a whole number.` })
    .int({ error: `Give ${what} as a whole number.` })
    .min(1, { error: `${what} starts at 1.` });

/** Which entry, in a tree of which size, an inclusion proof is asked for. */
export const inclusionQuerySchema = z.object({ seq: position("the entry's sequence number"), treeSize: position("the tree size") });
/** The two tree sizes a consistency proof joins. */
export const consistencyQuerySchema = z.object({ from: position("the earlier tree size"), to: position("the later tree size") });

/** A signed tree head a party kept, sent back to be checked against the trail now. */
export const keptTreeHeadSchema = z.object({
  treeSize: z.number().int().min(0),
  timestamp: z.string().min(1).max(40),
  rootHash: z.string().regex(/^[0-9a-f]{64}$/, { error: "The root hash is 64 hexadecimal characters." }),
  algorithm: z.literal("Ed25519"),
  keyId: z.string().regex(/^[0-9a-f]{64}$/, { error: "The key id is 64 hexadecimal characters." }),
  signature: z.string().min(1).max(200),
});
