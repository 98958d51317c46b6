/** Puts the server's per-field messages onto a react-hook-form form; returns the message for the rest. */
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiError, errorMessage } from "./api-client.ts";

export function applyServerErrors<T extends FieldValues>(
  err: unknown,
  setError: UseFormSetError<T>,
  fields: readonly string[],
): string | null {
  if (err instanceof ApiError && err.errors.length) {
    const unmatched = err.errors.filter((e) => !fields.includes(e.path));
    for (const e of err.errors) if (fields.includes(e.path)) setError(e.path as Path<T>, { message: e.message });
    return unmatched.length ? unmatched.map((e) => e.message).join(" ") : null;
  }
  return errorMessage(err);
}
