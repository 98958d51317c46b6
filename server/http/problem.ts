/** How each kind of error reads over HTTP: its status code in an RFC 9457 problem document. */
import type { Request, Response } from "express";
import type { AppError, ErrorKind } from "../errors.ts";

export const STATUS_OF: Record<ErrorKind, number> = {
  bad_request: 400,
  validation: 400,
  unauthenticated: 401,
  payment_declined: 402,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  too_large: 413,
  unsupported_media: 415,
  rate_limited: 429,
  upstream_failed: 502,
  unavailable: 503,
};

export const statusOf = (err: AppError) => STATUS_OF[err.kind];

/** Writes one problem document; every error answer of the API goes through here. */
export function sendProblem(
  req: Request,
  res: Response,
  problem: { status: number; title: string; detail: string; retryAfterSeconds?: number; extra?: Record<string, unknown> },
) {
  if (problem.retryAfterSeconds) res.set("Retry-After", String(problem.retryAfterSeconds));
  const body = {
    type: "about:blank",
    title: problem.title,
    status: problem.status,
    detail: problem.detail,
    instance: req.originalUrl,
    requestId: req.id,
    ...problem.extra,
  };
  return res.status(problem.status).type("application/problem+json").send(JSON.stringify(body));
}
