import { z } from "zod";

/** A positive integer id taken from a URL segment. */
export const idParam = z.coerce
  .number({ error: "Must be a number." })
  .int({ error: "Must be a whole number." })
  .positive({ error: "Must be positive." })
  .max(2 ** 31 - 1, { error: "Is too large." });
