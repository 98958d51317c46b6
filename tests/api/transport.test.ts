/**
 * What a signed-in request costs on the wire and in the database: compressed answers (RFC 9110
 * §8.4 Content-Encoding), content-hashed assets cached for good (RFC 8246 "immutable"), and one
 * query to load the session's user with their memberships.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync, mkdirSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import request from "supertest";
import { buildTestApp, DEMO, signInAs, type TestApp } from "../support/api.ts";

let t: TestApp;
let prod: TestApp;
let client: string;
beforeAll(() => {
  client = mkdtempSync(path.join(os.tmpdir(), "cellarpact-client-"));
  mkdirSync(path.join(client, "assets"));
  writeFileSync(path.join(client, "index.html"), "<!doctype html><title>Cellarpact</title>");
  writeFileSync(path.join(client, "assets", "index-3f9a1c.js"), `console.log(${JSON.stringify("x".repeat(4000))});`);
  prod = buildTestApp({
    CLIENT_DIR: client,
    NODE_ENV: "production",
    JWT_SECRET: "a-test-secret-that-is-long-enough-for-production-0123456789",
  });
  t = buildTestApp();
});
afterAll(async () => {
  await prod.close();
  await t.close();
});

describe("the wire", () => {
  it("when a client accepts gzip, then a JSON answer comes compressed", async () => {
    const res = await request(t.app).get("/api/openapi.json").set("Accept-Encoding", "gzip");
    expect(res.status).toBe(200);
    expect(res.headers["content-encoding"]).toBe("gzip");
    expect(res.body.openapi).toMatch(/^3\.1/);
  });

  it("when a hashed asset is fetched, then it may be cached for a year as immutable; the page itself is revalidated", async () => {
    const asset = await request(prod.app).get("/assets/index-3f9a1c.js");
    expect(asset.status).toBe(200);
    expect(asset.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
    const page = await request(prod.app).get("/lots");
    expect(page.status).toBe(200);
    expect(page.headers["cache-control"]).toBe("public, max-age=0");
    expect((await request(prod.app).get("/assets/missing-0000.js")).status).toBe(404);
  });
});

describe("the session", () => {
  it("when a signed-in request arrives, then one query loads the user with their memberships", async () => {
    const me = await signInAs(t.app, DEMO.buyerTechnologist);
    const statements: string[] = [];
    // Sequelize reads options.logging on every query; the typings leave `options` out.
    const options = (t.sequelize as unknown as { options: { logging: false | ((sql: string) => void) } }).options;
    options.logging = (sql) => statements.push(sql);
    try {
      const res = await me.agent.get("/api/auth/session");
      expect(res.status).toBe(200);
      expect(res.body.user.memberships).toHaveLength(1);
    } finally {
      options.logging = false;
    }
    expect(statements).toHaveLength(1);
  });
});
