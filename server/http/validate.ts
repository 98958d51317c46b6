import type { ZodError, ZodType } from "zod";
import { validationFailed, type FieldError } from "../errors.ts";

export function zodFieldErrors(error: ZodError, prefix?: string): FieldError[] {
  return error.issues.map((issue) => ({
    path: [prefix, ...issue.path.map(String)].filter(Boolean).join(".") || "(body)",
    message: issue.message,
  }));
}

/** Parses one part of the request or throws a 400 listing every field that failed. */
export function parseOrThrow<T>(schema: ZodType<T>, value: unknown, part: "body" | "query" | "params"): T {
  const result = schema.safeParse(value ?? (part === "body" ? undefined : {}));
  if (!result.success) throw validationFailed(zodFieldErrors(result.error, part === "body" ? undefined : part));
  return result.data;
}
