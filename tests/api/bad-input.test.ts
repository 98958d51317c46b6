import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { buildTestApp, DEMO, ORG, signInAs, type TestApp, type SignedInAgent } from "../support/api.ts";

let t: TestApp;
let admin: SignedInAgent;
const invitationCount = async () =>
  (await t.sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM invitations", { type: QueryTypes.SELECT }))[0]!.n;

beforeAll(async () => {
  t = buildTestApp();
  admin = await signInAs(t.app, DEMO.retailerAdmin);
});
afterAll(() => t.close());

const post = (body: string | object, type = "application/json") =>
  admin.agent.post(`/api/orgs/${ORG.retailer}/invitations`).set("x-csrf-token", admin.csrf).set("content-type", type).send(body);

describe("bad input gets a specific 4xx and writes nothing", () => {
  it("when the JSON is malformed, then 400 'Malformed JSON'", async () => {
    const before = await invitationCount();
    const res = await post('{"email": "a@b.test", "role": ');
    expect(res.status).toBe(400);
    expect(res.body.title).toBe("Malformed JSON");
    expect(await invitationCount()).toBe(before);
  });

  it("when the body is larger than the limit, then 413", async () => {
    const before = await invitationCount();
    const res = await post({ email: "a@b.test", role: "buyer_finance", padding: "x".repeat(200_000) });
    expect(res.status).toBe(413);
    expect(await invitationCount()).toBe(before);
  });

  it("when fields have the wrong types, then each field gets its own message", async () => {
    const res = await post({ email: 42, role: ["org_admin"] });
    expect(res.status).toBe(400);
    const paths = (res.body.errors as { path: string }[]).map((e) => e.path).sort();
    expect(paths).toEqual(["email", "role"]);
    expect(res.body.errors.find((e: { path: string }) => e.path === "role").message).toBe("Choose a role.");
  });

  it("when strings are hostile, then they are refused or stored inert, never executed", async () => {
    const before = await invitationCount();
    for (const email of ["<script>alert(1)</script>@x.test", "a@b.test' OR 1=1 --", "a\u0000b@x.test", "x".repeat(300) + "@x.test"]) {
      const res = await post({ email, role: "buyer_finance" });
      expect(res.status, email).toBe(400);
      expect(res.body.errors[0].path).toBe("email");
    }
    expect(await invitationCount()).toBe(before);
    const name = await admin.agent.patch("/api/me").set("x-csrf-token", admin.csrf).send({ name: "<img src=x onerror=alert(1)>" });
    expect(name.status).toBe(400);
    expect(name.body.errors[0]).toEqual({ path: "name", message: "A name cannot contain < or >." });
  });

  it("when a path id is not a number, then 400 names the parameter", async () => {
    const res = await admin.agent.get("/api/orgs/abc/members");
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe("params");
  });

  it("when the body is missing altogether, then 400 rather than a crash", async () => {
    const res = await admin.agent.post(`/api/orgs/${ORG.retailer}/invitations`).set("x-csrf-token", admin.csrf);
    expect(res.status).toBe(400);
  });

  it("when the server hides internals in production, then a 500 carries no stack", async () => {
    const prod = buildTestApp({ NODE_ENV: "production", JWT_SECRET: "a-production-secret-that-is-long-enough-123" });
    // Break the database handle on purpose: a query against a closed pool fails inside the handler.
    await prod.sequelize.close();
    const { default: request } = await import("supertest");
    const res = await request(prod.app).post("/api/auth/sign-in").send({ email: DEMO.buyerFinance, password: "whatever-123" });
    expect(res.status).toBe(500);
    expect(res.body.stack).toBeUndefined();
    expect(res.body.detail).toMatch(/request id/);
    // The shared database handle was replaced by the broken one; put the working one back.
    t = buildTestApp();
  });
});
