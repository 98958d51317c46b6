/**
 * Requests that are broken below the JSON get problem details (RFC 9457), never a 500: a body its
 * Content-Encoding does not describe, a multipart body with a broken boundary, headers over the
 * size limit (431, RFC 6585 §5), and a database that does not answer (503 with Retry-After,
 * RFC 9110 §15.6.4). Display names that would carry a web address or a control character into
 * mails are refused (OWASP ASVS 5.0 V1.2, output encoding for mail content).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import net from "node:net";
import type { AddressInfo } from "node:net";
import { buildTestApp, DEMO, ORG, signInAs, type SignedInAgent, type TestApp } from "../support/api.ts";
import { answerClientErrors } from "../../server/http/client-errors.ts";
import { personNameSchema } from "../../shared/auth/schemas.ts";

let t: TestApp;
let admin: SignedInAgent;
beforeAll(async () => {
  t = buildTestApp();
  admin = await signInAs(t.app, DEMO.retailerAdmin);
});
afterAll(() => t.close());

const problem = (res: { status: number; headers: Record<string, string>; text: string }) => {
  expect(res.headers["content-type"]).toMatch(/^application\/problem\+json/);
  return JSON.parse(res.text) as { status: number; title: string; detail: string };
};

describe("broken requests", () => {
  it("when a body says gzip but is not, then 400 with a problem document", async () => {
    const res = await admin.agent
      .post(`/api/orgs/${ORG.retailer}/invitations`)
      .set("x-csrf-token", admin.csrf)
      .set("content-type", "application/json")
      .set("content-encoding", "gzip")
      .send('{"email":"a@b.test","role":"buyer_finance"}');
    expect(res.status).toBe(400);
    expect(problem(res).title).toBe("Malformed body");
  });

  it("when a multipart upload has a broken boundary, then 400 with a problem document", async () => {
    const res = await admin.agent
      .post(`/api/orgs/${ORG.retailer}/analyses/1/certificates`)
      .set("x-csrf-token", admin.csrf)
      .set("content-type", "multipart/form-data; boundary=----cut")
      .send('------cut\r\nContent-Disposition: form-data; name="file"; filename="a.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-1.4');
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    problem(res);
  });

  it("when the headers are larger than the server reads, then 431 with a problem document", async () => {
    const server = t.app.listen(0, "127.0.0.1");
    answerClientErrors(server);
    await new Promise((r) => server.once("listening", r));
    const { port } = server.address() as AddressInfo;
    const raw = await new Promise<string>((resolve, reject) => {
      const socket = net.connect(port, "127.0.0.1", () =>
        socket.write(`GET /api/health HTTP/1.1\r\nHost: x\r\nX-Padding: ${"p".repeat(40_000)}\r\n\r\n`),
      );
      let text = "";
      socket.on("data", (d) => (text += d));
      socket.on("end", () => resolve(text));
      socket.on("error", reject);
    });
    server.close();
    expect(raw).toMatch(/^HTTP\/1\.1 431 /);
    expect(raw).toContain("application/problem+json");
    expect(JSON.parse(raw.slice(raw.indexOf("\r\n\r\n") + 4)).status).toBe(431);
  });
});

describe("a database outage", () => {
  let down: TestApp;
  beforeAll(() => {
    // Nothing listens on port 9 (discard) on this machine.
    down = buildTestApp({ DB_PORT: "9" });
  });
  afterAll(() => down.close());

  it("when the database does not answer, then a request gets 503 with Retry-After, not 500", async () => {
    const res = await request(down.app).post("/api/auth/sign-in").send({ email: DEMO.buyerFinance, password: "whatever-it-is-2026" });
    expect(res.status).toBe(503);
    expect(res.headers["retry-after"]).toBe("30");
    expect(problem(res).detail).toMatch(/database/);
  });
});

describe("display names", () => {
  it("when a name carries a web address or a control character, then it is refused with a reason", () => {
    for (const name of ["Claim at https://evil.test", "Visit www.evil.test", "Lou evil.com", "Lou\nBérard", "Lou\u0007"]) {
      const r = personNameSchema.safeParse(name);
      expect(r.success, name).toBe(false);
    }
    expect(personNameSchema.safeParse("Lou Bérard-Saint.Clair").success).toBe(true);
  });
});
