/**
 * Every API request has a time budget: past it, the client gets a clear 503 problem instead of a
 * connection that hangs, and whatever the handler sends later is dropped (the route registry and
 * the error handler both check headersSent). Answers are also bounded by paging, windows and caps,
 * so no single request can hold an unbounded amount of data in memory.
 */
import type { RequestHandler } from "express";
import { sendProblem } from "./problem.ts";

export function requestBudget(ms: number): RequestHandler {
  return (req, res, next) => {
    const timer = setTimeout(() => {
      if (res.headersSent) return;
      req.log?.warn({ ms }, "request over its time budget");
      sendProblem(req, res, {
        status: 503,
        title: "Took too long",
        detail: `This request took longer than the ${Math.round(ms / 1000)} s the server allows. Narrow it (a shorter period, fewer lots) or try again later.`,
        retryAfterSeconds: 30,
      });
    }, ms);
    const done = () => clearTimeout(timer);
    res.once("finish", done);
    res.once("close", done);
    next();
  };
}
