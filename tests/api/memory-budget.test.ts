/**
 * The memory budget of a request, through the real app: a request that arrives while the heap is
 * nearly full is refused 503 with Retry-After (RFC 9110 §15.6.4 Service Unavailable), and an answer
 * over the answer budget is refused with a clear problem document (RFC 9457) instead of being
 * built and sent; either way the server goes on answering.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { buildTestApp, DEMO, signInAs, type TestApp } from "../support/api.ts";

let small: TestApp;
let full: TestApp;
beforeAll(() => {
  // 2 KB: the API description is larger, a session answer is smaller.
  small = buildTestApp({ ANSWER_BUDGET_BYTES: "2048" });
  // A share of the heap every running process is above.
  full = buildTestApp({ HEAP_BUDGET_FRACTION: "0.0001" });
});
afterAll(async () => {
  await small.close();
  await full.close();
});

describe("the request memory budget", () => {
  it("when an answer would pass the answer budget, then the client gets a clear 500 problem and smaller answers still go through", async () => {
    const { agent } = await signInAs(small.app, DEMO.buyerTechnologist);
    const me = await agent.get("/api/auth/session");
    expect(me.status).toBe(200);
    // The API's own description runs to many kilobytes.
    const big = await agent.get("/api/openapi.json");
    expect(big.status).toBe(500);
    expect(big.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(JSON.parse(big.text)).toMatchObject({ title: "Answer too large", status: 500 });
    expect(JSON.parse(big.text).detail).toContain("2 KB");
    expect((await agent.get("/api/auth/session")).status).toBe(200);
  });

  it("when the heap is above its budget, then a request is refused 503 with Retry-After, not run", async () => {
    const res = await request(full.app).get("/api/auth/session");
    expect(res.status).toBe(503);
    expect(res.headers["retry-after"]).toBe("30");
    expect(JSON.parse(res.text)).toMatchObject({ title: "Server busy", status: 503 });
  });
});
