import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import type { Router } from "express";
import { buildTestApp, type TestApp } from "../support/api.ts";

let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
afterAll(() => t.close());

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: Router & { stack?: Layer[] };
}

/** Every method + path that Express will actually answer, read from the router itself. */
function registeredRoutes(stack: Layer[]): string[] {
  return stack.flatMap((layer) => {
    if (layer.route) return Object.keys(layer.route.methods).map((m) => `${m.toUpperCase()} ${layer.route!.path}`);
    return layer.handle?.stack ? registeredRoutes(layer.handle.stack) : [];
  });
}

describe("route inventory (OWASP ASVS V8: every route declares its access rule)", () => {
  it("when the app is built, then every Express route is declared with an access rule and appears in the OpenAPI document", async () => {
    const stack = (t.app as unknown as { router: { stack: Layer[] } }).router.stack;
    const live = registeredRoutes(stack).filter((r) => r.includes("/api/"));
    const declared = t.registry.routes.map((r) => `${r.method.toUpperCase()} ${r.path}`);
    expect(live.length).toBeGreaterThan(15);
    expect([...live].sort()).toEqual([...declared].sort());
    for (const spec of t.registry.routes) expect(spec.access?.kind, `${spec.method} ${spec.path}`).toBeTruthy();

    const doc = (await request(t.app).get("/api/openapi.json")).body;
    expect(doc.openapi).toBe("3.1.0");
    for (const spec of t.registry.routes) {
      const op = doc.paths[spec.path.replace(/:(\w+)/g, "{$1}")]?.[spec.method];
      expect(op, `${spec.method} ${spec.path} in OpenAPI`).toBeDefined();
      expect(op["x-access"]).toMatch(/public|signed-in|platform admin|member of the organisation/);
    }
  });

  it("when a body schema exists, then the OpenAPI request body is the JSON Schema of that same zod schema", async () => {
    const doc = (await request(t.app).get("/api/openapi.json")).body;
    const invite = doc.paths["/api/orgs/{orgId}/invitations"].post.requestBody.content["application/json"].schema;
    expect(invite.required).toEqual(["email", "role"]);
    expect(invite.properties.role.enum).toContain("producer_quality");
  });

  it("when an unknown API path is asked for, then a problem+json 404 comes back", async () => {
    const res = await request(t.app).get("/api/no-such-thing");
    expect(res.status).toBe(404);
    expect(res.headers["content-type"]).toMatch(/application\/problem\+json/);
  });
});

describe("security headers (Express production best practices; helmet defaults)", () => {
  it("when any route answers, then CSP forbids framing and plugins, nosniff is set and X-Powered-By is absent", async () => {
    // Any organisation id will do: the headers come before the access check.
    for (const path of ["/api/health", "/api/auth/session", "/api/orgs/999999/members"]) {
      const res = await request(t.app).get(path);
      expect(res.headers["content-security-policy"]).toMatch(/frame-ancestors 'none'/);
      expect(res.headers["content-security-policy"]).toMatch(/object-src 'none'/);
      expect(res.headers["x-content-type-options"]).toBe("nosniff");
      expect(res.headers["referrer-policy"]).toBeDefined();
      expect(res.headers["x-powered-by"]).toBeUndefined();
      expect(res.headers["x-request-id"]).toBeDefined();
    }
  });

  it("when the database is up, then health says so", async () => {
    const res = await request(t.app).get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body.database.status).toBe("up");
  });
});
