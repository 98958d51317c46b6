/**
 * No anonymous way into an account (OWASP ASVS 5.0 V6 authentication; OWASP Top 10 A07): the app
 * never serves the mail the demo sends, in any mode.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { buildTestApp, type TestApp } from "../support/api.ts";

let dev: TestApp;
let prod: TestApp;
beforeAll(() => {
  dev = buildTestApp();
  prod = buildTestApp({ NODE_ENV: "production", JWT_SECRET: "a-test-secret-that-is-long-enough-for-production-0123456789" });
});
afterAll(async () => {
  await dev.close();
  await prod.close();
});

describe("the caught mail", () => {
  it("when an anonymous visitor asks the app for the inbox, then there is no such route in development or production", async () => {
    for (const t of [dev, prod]) {
      expect((await request(t.app).get("/api/dev/inbox")).status).toBe(404);
      expect(t.registry.routes.some((r) => /inbox|mail/i.test(r.path))).toBe(false);
    }
  });
});
