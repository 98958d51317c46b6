import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { buildTestApp, DEMO, ORG, signInAs, uniqueEmail, type TestApp } from "../support/api.ts";
import { startTestMail } from "../support/mail.ts";

let t: TestApp;
beforeAll(() => {
  t = buildTestApp();
});
afterAll(() => t.close());

describe("mail outbox (transactional outbox pattern, from memory)", () => {
  it("when the SMTP fake is down while an invitation is sent, then after it restarts the mail arrives exactly once", async () => {
    const first = await startTestMail();
    const port = first.fake.smtpPort;
    await first.deliver(); // flush anything earlier tests left queued
    await first.fake.stop();

    const admin = await signInAs(t.app, DEMO.producerAdmin);
    const email = uniqueEmail("outage");
    const res = await admin.agent
      .post(`/api/orgs/${ORG.troisSentes}/invitations`)
      .set("x-csrf-token", admin.csrf)
      .send({ email, role: "producer_quality" });
    expect(res.status).toBe(201);

    // The relay is down: the attempt fails and the message stays queued with the error recorded.
    expect(await first.deliver()).toBe(0);
    const [queued] = await t.sequelize.query<{ status: string; attempts: number; last_error: string }>(
      "SELECT status, attempts, last_error FROM outbox_messages WHERE to_address = ?",
      { replacements: [email], type: QueryTypes.SELECT },
    );
    expect(queued).toMatchObject({ status: "pending", attempts: 1 });
    expect(queued!.last_error).toMatch(/ECONNREFUSED/);
    first.transport.close();

    const second = await startTestMail(port);
    await new Promise((r) => setTimeout(r, 150)); // past the first retry delay
    await Promise.all([second.deliver(), second.deliver(), second.deliver()]);
    await second.deliver();
    expect(second.to(email)).toHaveLength(1);
    expect(second.to(email)[0]!.subject).toBe("You are invited to Domaine des Trois Sentes on Cellarpact");
    await second.stop();
  });
});
