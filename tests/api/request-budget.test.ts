/**
 * A request over its time budget gets a clear 503 problem (RFC 9110 §15.6.4 Service Unavailable,
 * with Retry-After; RFC 9457 problem details) rather than a hanging connection, and the late answer
 * of its handler is dropped without harming the requests that follow.
 */
import { describe, expect, it } from "vitest";
import express from "express";
import request from "supertest";
import { requestBudget } from "../../server/http/request-budget.ts";
import { errorHandler } from "../../server/http/error-handler.ts";

function appWithBudget(ms: number) {
  const app = express();
  app.use(requestBudget(ms));
  app.get("/slow", async (_req, res, next) => {
    await new Promise((r) => setTimeout(r, 300));
    try {
      if (!res.headersSent) res.json({ late: true });
      else throw new Error("answered already");
    } catch (err) {
      next(err);
    }
  });
  app.get("/fast", (_req, res) => void res.json({ ok: true }));
  app.use(errorHandler(true));
  return app;
}

describe("the request time budget", () => {
  it("when a handler runs past the budget, then the client gets 503 with Retry-After and the server goes on answering", async () => {
    const app = appWithBudget(40);
    const slow = await request(app).get("/slow");
    expect(slow.status).toBe(503);
    expect(slow.headers["retry-after"]).toBe("30");
    expect(slow.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(JSON.parse(slow.text)).toMatchObject({ status: 503, title: "Took too long" });
    await new Promise((r) => setTimeout(r, 350));
    expect((await request(app).get("/fast")).body).toEqual({ ok: true });
  });

  it("when a handler answers within the budget, then its answer goes through unchanged", async () => {
    const res = await request(appWithBudget(5_000)).get("/slow");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ late: true });
  });
});
