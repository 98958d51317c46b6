import { describe, expect, it } from "vitest";
import request from "supertest";
import jwt from "jsonwebtoken";
import { DEMO, DEMO_PASSWORD, ORG, signInAs } from "../support/api.ts";
import { linkIn } from "../support/mail.ts";
import { mail, openAppAndMail, t } from "../support/app-and-mail.ts";
import bcrypt from "bcryptjs";
import { QueryTypes } from "sequelize";
import { randomUUID } from "node:crypto";
import { changePassword, dummyHash, SIGN_IN_FAILED } from "../../server/services/auth-service.ts";
import { member, party } from "../support/factories.ts";
import { recordFailure } from "../../server/services/sign-in-throttle.ts";

openAppAndMail();

describe("sign-in", () => {
  it("when the password is right, then a session cookie is HttpOnly and SameSite and the CSRF token comes back", async () => {
    const res = await request(t.app).post("/api/auth/sign-in").send({ email: DEMO.buyerTechnologist, password: DEMO_PASSWORD });
    expect(res.status).toBe(200);
    const cookies = ([] as string[]).concat(res.headers["set-cookie"] ?? []);
    const session = cookies.find((c) => c.startsWith("cp_session="))!;
    expect(session).toMatch(/HttpOnly/);
    expect(session).toMatch(/SameSite=Lax/);
    expect(res.body.csrfToken).toMatch(/^[\w-]{20,}$/);
    expect(res.body.user.memberships[0]).toMatchObject({ organisationId: ORG.retailer, role: "buyer_technologist" });
  });

  it("when the user is unknown or the password wrong, then both get the same 401 message (OWASP ASVS 2.2 account enumeration, common practice)", async () => {
    const unknown = await request(t.app).post("/api/auth/sign-in").send({ email: "nobody@example.test", password: "whatever-123" });
    const wrong = await request(t.app).post("/api/auth/sign-in").send({ email: DEMO.labAdmin, password: "not-the-password" });
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect(unknown.body.detail).toBe(SIGN_IN_FAILED);
    expect(wrong.body.detail).toBe(unknown.body.detail);
  });

  // The test config gives 5 free failures (vite.config.ts); each test uses people of its own, as the waits are kept in the database.
  /** Wrong passwords from one client (with this cookie, if any): 401 while free, 429 once the account waits. */
  const fail = async (email: string, times: number, cookie?: string) => {
    for (let i = 0; i < times; i++) {
      const res = await request(t.app)
        .post("/api/auth/sign-in")
        .set("Cookie", cookie ?? "")
        .send({ email, password: `Wrong-guess-${i}-x` });
      expect([401, 429]).toContain(res.status);
    }
  };
  /** Signs in with the right password and answers the device cookie the browser would keep. */
  const deviceCookieOf = async (email: string, password: string) => {
    const res = await request(t.app).post("/api/auth/sign-in").send({ email, password });
    expect(res.status).toBe(200);
    const cookie = (res.headers["set-cookie"] as unknown as string[]).find((c) => c.startsWith("cp_device="));
    expect(cookie).toMatch(/HttpOnly/);
    return cookie!.split(";")[0]!;
  };
  const someone = async () => {
    const buyer = await party(DEMO.buyerTechnologist, "buyer_technologist");
    const password = `Cellar-door-${randomUUID()}`;
    return { ...(await member(buyer.orgId, "buyer_finance", { password })), password };
  };

  it("when an unknown client fails past the free attempts, then it waits with a growing delay, even with the right password (OWASP ASVS 5.0 V6.3)", async () => {
    const p = await someone();
    await fail(p.user.email, 6);
    const blocked = await request(t.app).post("/api/auth/sign-in").send({ email: p.user.email, password: p.password });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers["retry-after"])).toBeGreaterThan(20);
    expect(Number(blocked.headers["retry-after"])).toBeLessThanOrEqual(30);
    expect(blocked.body.detail).toMatch(/Too many failed sign-in attempts\. Try again in \d+ seconds, or reset your password\./);
    // Each further failure doubles the wait: 30 s after the sixth, 60 s after the seventh.
    const waitOf = async () => {
      const [row] = await t.sequelize.query<{ until: Date }>("SELECT blocked_until AS until FROM sign_in_throttles WHERE subject = ?", {
        replacements: [`account:${p.user.email}`],
        type: QueryTypes.SELECT,
      });
      return (new Date(row!.until).getTime() - Date.now()) / 1000;
    };
    expect(await waitOf()).toBeLessThanOrEqual(30);
    await recordFailure(`account:${p.user.email}`, 5);
    expect(await waitOf()).toBeGreaterThan(30);
    expect(await waitOf()).toBeLessThanOrEqual(60);
  });

  it("when an attacker fails on the account from elsewhere, then the owner's browser that signed in before is not slowed", async () => {
    const p = await someone();
    const ownersBrowser = await deviceCookieOf(p.user.email, p.password);
    await fail(p.user.email, 9);
    expect((await request(t.app).post("/api/auth/sign-in").send({ email: p.user.email, password: p.password })).status).toBe(429);
    const owner = await request(t.app)
      .post("/api/auth/sign-in")
      .set("Cookie", ownersBrowser)
      .send({ email: p.user.email, password: p.password });
    expect(owner.status).toBe(200);
  });

  it("when a browser's device cookie was earned on another account, then it vouches for nothing here", async () => {
    const [mine, victim] = [await someone(), await someone()];
    const attackersBrowser = await deviceCookieOf(mine.user.email, mine.password);
    await fail(victim.user.email, 6, attackersBrowser);
    expect((await request(t.app).post("/api/auth/sign-in").send({ email: victim.user.email, password: victim.password })).status).toBe(429);
  });

  it("when the owner completes a password reset, then every wait on the account is lifted", async () => {
    const p = await someone();
    await fail(p.user.email, 7);
    await request(t.app).post("/api/auth/password-reset/request").send({ email: p.user.email });
    await mail.deliver();
    const token = linkIn(mail.to(p.user.email).at(-1)!.text, "/reset-password");
    const fresh = `Cellar-key-${randomUUID()}`;
    expect((await request(t.app).post("/api/auth/password-reset").send({ token, password: fresh })).status).toBe(200);
    expect((await request(t.app).post("/api/auth/sign-in").send({ email: p.user.email, password: fresh })).status).toBe(200);
  });
});

describe("session tokens and CSRF", () => {
  it("when a cookie-authenticated write lacks the CSRF header, then it is refused with 403 and nothing changes", async () => {
    const { agent, csrf } = await signInAs(t.app, DEMO.producerAdmin);
    const refused = await agent.patch("/api/me").send({ name: "Changed Without Token" });
    expect(refused.status).toBe(403);
    const me = await agent.get("/api/auth/session");
    expect(me.body.user.name).toBe("Mathieu Rocheval");
    const ok = await agent.patch("/api/me").set("x-csrf-token", csrf).send({ name: "Mathieu Rocheval" });
    expect(ok.status).toBe(200);
  });

  it("when a token is signed with alg none or tampered, then the caller is anonymous", async () => {
    const none = jwt.sign({ sv: 0 }, "", { algorithm: "none", subject: "1", jwtid: "x" });
    const res = await request(t.app).get(`/api/orgs/${ORG.retailer}/members`).set("Cookie", `cp_session=${none}`);
    expect(res.status).toBe(401);
    const forged = jwt.sign({ sv: 0 }, "some-other-secret-some-other-secret", { algorithm: "HS256", subject: "2", jwtid: "y" });
    expect((await request(t.app).get(`/api/orgs/${ORG.retailer}/members`).set("Cookie", `cp_session=${forged}`)).status).toBe(401);
  });

  it("when the user signs out, then the old cookie no longer works", async () => {
    const res = await request(t.app).post("/api/auth/sign-in").send({ email: DEMO.labAnalyst, password: DEMO_PASSWORD });
    const oldCookie = ([] as string[])
      .concat(res.headers["set-cookie"] ?? [])
      .find((c) => c.startsWith("cp_session="))!
      .split(";")[0]!;
    expect((await request(t.app).get(`/api/orgs/${ORG.lab}/members`).set("Cookie", oldCookie)).status).toBe(200);
    const { agent, csrf } = await signInAs(t.app, DEMO.labAnalyst);
    expect((await agent.post("/api/auth/sign-out").set("x-csrf-token", csrf)).status).toBe(204);
    const after = await request(t.app).get(`/api/orgs/${ORG.lab}/members`).set("Cookie", oldCookie);
    expect(after.status).toBe(401);
  });
});

describe("password reset by mailed one-time link", () => {
  it("when a reset is requested, then the mailed link sets a new password once and only once", async () => {
    const email = DEMO.buyerFinance;
    const asked = await request(t.app).post("/api/auth/password-reset/request").send({ email });
    expect(asked.status).toBe(202);
    await mail.deliver();
    // Other mail for this person (receipts from earlier test files) may be queued too.
    const message = mail.to(email).find((m) => m.subject === "Reset your Cellarpact password");
    expect(message).toBeDefined();
    const token = linkIn(message!.text, "/reset-password");

    const newPassword = "Harvest-moon-2027";
    expect((await request(t.app).post("/api/auth/password-reset").send({ token, password: newPassword })).status).toBe(200);
    expect((await request(t.app).post("/api/auth/password-reset").send({ token, password: "Another-one-2028" })).status).toBe(410);
    expect((await request(t.app).post("/api/auth/sign-in").send({ email, password: newPassword })).status).toBe(200);
    // Put the demo password back for the browser tests.
    await request(t.app).post("/api/auth/password-reset/request").send({ email });
    await mail.deliver();
    const again = linkIn(
      mail
        .to(email)
        .filter((m) => m.subject === "Reset your Cellarpact password")
        .at(-1)!.text,
      "/reset-password",
    );
    expect((await request(t.app).post("/api/auth/password-reset").send({ token: again, password: DEMO_PASSWORD })).status).toBe(200);
  });

  it("when one of several reset links is used, or the password is changed, then every other link stops working (OWASP ASVS 5.0 V6.4)", async () => {
    const buyer = await party(DEMO.buyerTechnologist, "buyer_technologist");
    const password = `Old-cellar-${randomUUID()}`;
    const someone = await member(buyer.orgId, "buyer_finance", { password });
    const email = someone.user.email;
    const linkFor = async () => {
      expect((await request(t.app).post("/api/auth/password-reset/request").send({ email })).status).toBe(202);
      await mail.deliver();
      return linkIn(mail.to(email).at(-1)!.text, "/reset-password");
    };
    const [first, second] = [await linkFor(), await linkFor()];
    expect(first).not.toBe(second);
    expect(
      (
        await request(t.app)
          .post("/api/auth/password-reset")
          .send({ token: second, password: `New-cellar-${randomUUID()}` })
      ).status,
    ).toBe(200);
    expect(
      (
        await request(t.app)
          .post("/api/auth/password-reset")
          .send({ token: first, password: `Other-cellar-${randomUUID()}` })
      ).status,
    ).toBe(410);

    const third = await linkFor();
    const reset = `Reset-cellar-${randomUUID()}`;
    const fourth = await linkFor();
    expect((await request(t.app).post("/api/auth/password-reset").send({ token: fourth, password: reset })).status).toBe(200);
    await changePassword(someone.user.id, reset, `Changed-cellar-${randomUUID()}`);
    expect(
      (
        await request(t.app)
          .post("/api/auth/password-reset")
          .send({ token: third, password: `Late-cellar-${randomUUID()}` })
      ).status,
    ).toBe(410);
  });

  it("when a new password is common, guessable, built from the address or holds a control character, then it is refused and the link still works (OWASP ASVS 5.0 V6.2)", async () => {
    const buyer = await party(DEMO.buyerTechnologist, "buyer_technologist");
    const someone = await member(buyer.orgId, "buyer_finance", { email: `marguerite.${randomUUID().slice(0, 6)}@example.test` });
    const email = someone.user.email;
    await request(t.app).post("/api/auth/password-reset/request").send({ email });
    await mail.deliver();
    const token = linkIn(mail.to(email).at(-1)!.text, "/reset-password");
    const refused = async (password: string) => {
      const res = await request(t.app).post("/api/auth/password-reset").send({ token, password });
      expect(res.status, password).toBe(400);
      return res.body.errors[0].message as string;
    };
    expect(await refused("aaaaaaaaaa")).toMatch(/too easy to guess/);
    expect(await refused("password12")).toMatch(/too easy to guess.*commonly used/);
    expect(await refused(`${email.split("@")[0]}-2027`)).toMatch(/e-mail address/);
    expect(await refused("Harvest\tmoon-2027")).toMatch(/control characters/);
    // Nothing was used up: the same link still sets a good password.
    expect((await request(t.app).post("/api/auth/password-reset").send({ token, password: "Harvest-moon-2027" })).status).toBe(200);
  });

  it("when the account is unknown, then the password is still compared against a hash of the configured work factor (OWASP ASVS 5.0 V6.3)", () => {
    expect(bcrypt.getRounds(dummyHash())).toBe(t.config.BCRYPT_COST);
  });

  it("when the address has no account, then the answer is the same and no mail is queued", async () => {
    const res = await request(t.app).post("/api/auth/password-reset/request").send({ email: "ghost@example.test" });
    expect(res.status).toBe(202);
    await mail.deliver();
    expect(mail.to("ghost@example.test")).toHaveLength(0);
  });
});
