/**
 * The errors use cases throw, named for what went wrong rather than for a protocol. The HTTP layer
 * (`server/http/problem.ts`) turns each kind into a status code and an RFC 9457 problem document.
 */
export type ErrorKind =
  | "bad_request"
  | "validation"
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "conflict"
  | "gone"
  | "too_large"
  | "unsupported_media"
  | "rate_limited"
  | "payment_declined"
  | "upstream_failed"
  | "unavailable";

export interface FieldError {
  path: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly kind: ErrorKind,
    readonly title: string,
    readonly detail?: string,
    readonly errors?: FieldError[],
    /** For a refusal that passes: how long the client should wait before trying again. */
    readonly retryAfterSeconds?: number,
  ) {
    super(detail ?? title);
  }
}

export const badRequest = (detail: string, errors?: FieldError[]) => new AppError("bad_request", "Bad request", detail, errors);
export const validationFailed = (errors: FieldError[]) =>
  new AppError("validation", "Validation failed", "Some fields are not valid; see errors.", errors);
export const unauthorized = (detail = "Sign in to continue.") => new AppError("unauthenticated", "Not signed in", detail);
export const forbidden = (detail: string) => new AppError("forbidden", "Forbidden", detail);
/** Also used for data of other organisations, so a caller cannot learn that it exists. */
export const notFound = (what = "The resource") => new AppError("not_found", "Not found", `${what} was not found.`);
export const conflict = (detail: string) => new AppError("conflict", "Conflict", detail);
export const gone = (detail: string) => new AppError("gone", "Gone", detail);
export const tooLarge = (detail: string) => new AppError("too_large", "Payload too large", detail);
export const unsupportedMedia = (detail: string) => new AppError("unsupported_media", "Unsupported media type", detail);
export const tooManyRequests = (detail: string, retryAfterSeconds?: number) =>
  new AppError("rate_limited", "Too many requests", detail, undefined, retryAfterSeconds);
export const paymentDeclined = (detail: string) => new AppError("payment_declined", "Payment declined", detail);
export const upstreamFailed = (title: string, detail: string) => new AppError("upstream_failed", title, detail);
export const unavailable = (detail: string) => new AppError("unavailable", "Service unavailable", detail);
