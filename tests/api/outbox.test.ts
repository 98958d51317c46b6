import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { buildTestApp, DEMO, ORG, signInAs, uniqueEmail, type TestApp } from "../support/api.ts";
import { startTestMail } from "../support/mail.ts";
import { inTransaction } from "../../server/db/database.ts";
import { enqueueMail, OUTBOX_BATCH } from "../../server/integrations/mail/outbox.ts";

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

  it("when an invitation is queued behind a burst of notifications, then it leaves in the first batch", async () => {
    const mail = await startTestMail();
    await mail.deliver();
    const burst = uniqueEmail("burst");
    await inTransaction(async (tx) => {
      for (let i = 0; i < OUTBOX_BATCH * 3; i++)
        await enqueueMail(tx, { to: burst, subject: `Update ${i}`, text: "x", kind: "notification", coalesceKey: `burst-${i}` });
    });
    const invited = uniqueEmail("invited");
    await inTransaction((tx) => enqueueMail(tx, { to: invited, subject: "You are invited", text: "link" }));
    const order: string[] = [];
    mail.fake.messages.length = 0;
    await mail.deliver();
    for (const m of mail.fake.messages) order.push(m.to[0]!);
    expect(order.indexOf(invited)).toBeGreaterThanOrEqual(0);
    expect(order.indexOf(invited)).toBeLessThan(OUTBOX_BATCH);
    expect(order.filter((a) => a === burst)).toHaveLength(OUTBOX_BATCH * 3);
    await mail.stop();
  });

  it("when a thread's comments come while the first mail still waits, then they go out as one mail that holds them all", async () => {
    const mail = await startTestMail();
    await mail.deliver();
    const reader = uniqueEmail("reader");
    for (const i of [1, 2, 3])
      await inTransaction((tx) =>
        enqueueMail(tx, {
          to: reader,
          subject: `Comment ${i} on deviation #7`,
          text: `comment ${i}`,
          kind: "notification",
          coalesceKey: "u1:/deviations/7",
        }),
      );
    await inTransaction((tx) => enqueueMail(tx, { to: reader, subject: "Mentioned", text: "m", kind: "notification" }));
    await mail.deliver();
    const got = mail.to(reader);
    expect(got.map((m) => m.subject).sort()).toEqual(["Comment 1 on deviation #7 (+2 more)", "Mentioned"]);
    expect(got.find((m) => m.subject.startsWith("Comment"))!.text).toMatch(/comment 1[\s\S]*comment 2[\s\S]*comment 3/);
    // Each message keeps the Message-ID it was queued with, so a resend after a crash is recognisable.
    const [row] = await t.sequelize.query<{ key: string }>(
      "SELECT message_key AS `key` FROM outbox_messages WHERE to_address = ? AND subject LIKE 'Comment%'",
      {
        replacements: [reader],
        type: QueryTypes.SELECT,
      },
    );
    expect(got.find((m) => m.subject.startsWith("Comment"))!.messageId).toBe(`<${row!.key}@cellarpact.test>`);
    await mail.stop();
  });
});
