import type { Response } from "express";

/** An idempotent write answers with its route's success status the first time, and 200 with the same body on a replay. */
export function idempotentAnswer<T>(res: Response, outcome: { replayed: boolean; response: T }): T {
  if (outcome.replayed) res.locals.status = 200;
  return outcome.response;
}
