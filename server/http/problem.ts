/** Errors that map onto RFC 9457 problem details. */
export interface FieldError {
  path: string;
  message: string;
}

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail?: string,
    readonly errors?: FieldError[],
  ) {
    super(detail ?? title);
  }
}

export const badRequest = (detail: string, errors?: FieldError[]) => new HttpError(400, "Bad request", detail, errors);
export const validationFailed = (errors: FieldError[]) =>
  new HttpError(400, "Validation failed", "Some fields are not valid; see errors.", errors);
export const unauthorized = (detail = "Sign in to continue.") => new HttpError(401, "Not signed in", detail);
export const forbidden = (detail: string) => new HttpError(403, "Forbidden", detail);
/** Also used for data of other organisations, so a caller cannot learn that it exists. */
export const notFound = (what = "The resource") => new HttpError(404, "Not found", `${what} was not found.`);
export const conflict = (detail: string) => new HttpError(409, "Conflict", detail);
export const gone = (detail: string) => new HttpError(410, "Gone", detail);
export const tooManyRequests = (detail: string) => new HttpError(429, "Too many requests", detail);
