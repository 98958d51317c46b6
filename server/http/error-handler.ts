/** Turns anything thrown into a problem+json response; hides internals in production. */
import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError } from "zod";
import { MulterError } from "multer";
import { AppError, tooLarge, unsupportedMedia, validationFailed } from "../errors.ts";
import { sendProblem, statusOf } from "./problem.ts";
import { zodFieldErrors } from "./validate.ts";

interface BodyParserError {
  type?: string;
  status?: number;
  limit?: number;
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
    if (!known && !production && err instanceof Error) extra.stack = err.stack;
    sendProblem(req, res, {
      status,
      title: known?.title ?? "Internal server error",
      detail: known?.detail ?? "Something went wrong on our side. The request id identifies it in the server log.",
      extra,
    });
  };
}

export const notFoundHandler: RequestHandler = (req, res) => {
  sendProblem(req, res, { status: 404, title: "Not found", detail: `No API route matches ${req.method} ${req.path}.` });
};
