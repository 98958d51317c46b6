/**
 * The request log holds one compact line per request and nothing that lets a reader act as
 * someone: no cookie, CSRF token or Authorization header, and no one-time token from a mailed
 * link's path (OWASP Logging Cheat Sheet, "data to exclude"; OWASP ASVS 5.0 V16.2).
 */
import { describe, expect, it } from "vitest";
import request from "supertest";
import { pino } from "pino";
import { Writable } from "node:stream";
import { loadConfig } from "../../server/config.ts";
import { createApp } from "../../server/app.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { useDatabase } from "../../server/db/database.ts";
import { redactUrl } from "../../server/http/request-log.ts";

describe("the request log", () => {
  it("when requests carry tokens in headers and paths, then the log has one short line each with none of them", async () => {
    const lines: string[] = [];
    const sink = new Writable({ write: (chunk, _enc, done) => (lines.push(String(chunk)), done()) });
    const config = loadConfig({ ...process.env, LOG_LEVEL: "info" });
    const sequelize = createSequelize(config);
    useDatabase(sequelize);
    const { app } = createApp(config, pino({ level: "info" }, sink));
    const secret = "tok_9f8e7d6c5b4a39281706";
    await request(app).get(`/api/invitations/${secret}`).set("Authorization", `Bearer ${secret}`).set("Cookie", `cp_session=${secret}`);
    await request(app).get(`/reset-password/${secret}?token=${secret}`).set("X-CSRF-Token", secret);
    await sequelize.close();
    const requests = lines.filter((l) => l.includes('"req"'));
    expect(requests.length).toBe(2);
    for (const line of requests) {
      expect(line).not.toContain(secret);
      expect(line).not.toMatch(/authorization|cookie|user-agent/i);
      expect(line.length).toBeLessThan(400);
    }
    expect(requests[0]).toContain("/api/invitations/[token]");
  });

  it("when a path names an action rather than a token, then it is left as it is", () => {
    expect(redactUrl("/api/invitations/accept")).toBe("/api/invitations/accept");
    expect(redactUrl("/api/orgs/3/lots?limit=50")).toBe("/api/orgs/3/lots?limit=50");
    expect(redactUrl("/accept-invitation/abc?x=1")).toBe("/accept-invitation/[token]?x=1");
  });
});
