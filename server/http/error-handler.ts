/** Turns anything thrown into a problem+json response; hides internals in production. */
import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError } from "zod";
import { MulterError } from "multer";
import { ConnectionError } from "sequelize";
import { AppError, tooLarge, unavailable, unsupportedMedia, validationFailed } from "../errors.ts";
import { sendProblem, statusOf } from "./problem.ts";
import { zodFieldErrors } from "./validate.ts";

interface BodyParserError {
  type?: string;
  status?: number;
  limit?: number;
  code?: string;
  expose?: boolean;
}

/** What busboy says of a multipart body it cannot read (a broken or missing boundary, a cut-off part). */
const BROKEN_MULTIPART = /^(Unexpected end of form|Unexpected end of multipart data|Malformed part header|Multipart: Boundary not found)/;

/** The database cannot be reached or dropped the connection: a passing state, said as 503 with Retry-After. */
function databaseDown(err: unknown): boolean {
  if (err instanceof ConnectionError) return true;
  const e = err as { fatal?: boolean; code?: string; parent?: unknown };
  if (e?.parent) return databaseDown(e.parent);
  return (
    e?.fatal === true || ["ECONNREFUSED", "ER_SOCKET_UNEXPECTED_CLOSE", "ER_GET_CONNECTION_TIMEOUT", "ECONNRESET"].includes(e?.code ?? "")
  );
}

function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof MulterError) {
    if (err.code === "LIMIT_FILE_SIZE") return tooLarge("The file is larger than the upload limit.");
    return new AppError("bad_request", "Bad upload", `The upload was not accepted: ${err.message}. Send one file in the field "file".`);
  }
  if (err instanceof ZodError) return validationFailed(zodFieldErrors(err));
  const e = err as BodyParserError;
  if (e?.type === "entity.parse.failed") return new AppError("bad_request", "Malformed JSON", "The request body is not valid JSON.");
  if (e?.type === "entity.too.large") return tooLarge(`The request body exceeds the limit of ${e.limit} bytes.`);
  if (e?.type === "encoding.unsupported" || e?.type === "charset.unsupported") return unsupportedMedia("Send the body as UTF-8 JSON.");
  // A body its Content-Encoding does not describe (a gzip header on plain bytes): zlib's error, passed on as a 400.
  if (e?.status === 400 && e.code?.startsWith("Z_"))
    return new AppError(
      "bad_request",
      "Malformed body",
      "The request body could not be decompressed; send it as its Content-Encoding says.",
    );
  if (err instanceof Error && BROKEN_MULTIPART.test(err.message))
    return new AppError(
      "bad_request",
      "Malformed upload",
      `The multipart body could not be read (${err.message}). Send one file in the field "file".`,
    );
  if (databaseDown(err)) return unavailable("The database is not answering for a moment; try again shortly.");
  return null;
}

export function errorHandler(production: boolean): ErrorRequestHandler {
  return (err, req, res, next) => {
    // Already answered (the time budget ran out first): Express's own handler closes the connection.
    if (res.headersSent) return next(err);
    const known = toAppError(err);
    const status = known ? statusOf(known) : 500;
    if (!known) req.log?.error({ err }, "unhandled error");
    const extra: Record<string, unknown> = {};
    if (known?.errors) extra.errors = known.errors;
    if (known?.kind === "unavailable") req.log?.error({ err }, "database unavailable");
    if (!known && !production && err instanceof Error) extra.stack = err.stack;
    sendProblem(req, res, {
      status,
      title: known?.title ?? "Internal server error",
      detail: known?.detail ?? "Something went wrong on our side. The request id identifies it in the server log.",
      extra,
      ...(known?.kind === "unavailable" ? { retryAfterSeconds: 30 } : {}),
      ...(known?.retryAfterSeconds ? { retryAfterSeconds: known.retryAfterSeconds } : {}),
    });
  };
}

export const notFoundHandler: RequestHandler = (req, res) => {
  sendProblem(req, res, { status: 404, title: "Not found", detail: `No API route matches ${req.method} ${req.path}.` });
};
