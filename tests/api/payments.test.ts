/**
 * Paying for audits through the stripe SDK against the local Stripe fake, and Stripe's webhooks.
 * Behaviour checked against Stripe's documentation: webhook signatures and the 300 s tolerance
 * (docs.stripe.com/webhooks#verify-manually; stripe-node DEFAULT_TOLERANCE), at-least-once delivery
 * in any order (docs.stripe.com/webhooks#handle-duplicate-events), idempotent requests
 * (docs.stripe.com/api/idempotent_requests) and the test cards (docs.stripe.com/testing).
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import Stripe from "stripe";
import type http from "node:http";
import type { AddressInfo } from "node:net";
import { randomUUID } from "node:crypto";
import { buildTestApp, DEMO, getPdf, ORG, signInAs, type SignedInAgent, type TestApp, CONTRACT } from "../support/api.ts";
import { startTestMail } from "../support/mail.ts";
import { startStripeFake, type StripeFake } from "../../server/fakes/stripe/server.ts";
import { signed, succeededEvent, TEST_WEBHOOK_SECRET } from "../support/stripe-events.ts";

const SECRET = TEST_WEBHOOK_SECRET;
let t: TestApp;
let server: http.Server;
let base: string;
let fake: StripeFake;
let mail: Awaited<ReturnType<typeof startTestMail>>;
let finance: SignedInAgent;
let sdk: Stripe;

beforeAll(async () => {
  fake = await startStripeFake({ webhook: { secret: SECRET, retryBaseMs: 50, maxAttempts: 4 } });
  t = buildTestApp({ STRIPE_API_PORT: String(fake.port), STRIPE_WEBHOOK_SECRET: SECRET });
  server = t.app.listen(0, "127.0.0.1");
  await new Promise((r) => server.once("listening", r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.webhooks.point(`${base}/api/webhooks/stripe`);
  mail = await startTestMail();
  finance = await signInAs(t.app, DEMO.buyerFinance);
  sdk = new Stripe("sk_test_payments", { host: "127.0.0.1", port: fake.port, protocol: "http", maxNetworkRetries: 0, telemetry: false });
});
afterAll(async () => {
  await fake.stop();
  await new Promise((r) => server.close(r));
  await mail.stop();
  await t.close();
});

const B = (p: string) => `/api/orgs/${ORG.retailer}${p}`;
const q = async <T extends object>(sql: string, replacements: unknown[] = []) =>
  t.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
const countOf = async (sql: string, replacements: unknown[] = []) => Number((await q<{ n: number }>(sql, replacements))[0]!.n);

async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, ms = 8000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

async function anyLotOfContract(contractId: number) {
  const lots = await finance.agent.get(B(`/lots?contract=${contractId}`));
  expect(lots.status).toBe(200);
  return lots.body.items[0].id as number;
}

async function placeOrder(parameters = ["volatile_acidity", "free_so2"]) {
  const lotId = await anyLotOfContract(CONTRACT.sentierBlanc);
  const res = await finance.agent
    .post(B("/audit-orders"))
    .set("x-csrf-token", finance.csrf)
    .send({
      idempotencyKey: randomUUID(),
      contractId: CONTRACT.sentierBlanc,
      laboratoryOrgId: ORG.lab,
      lotIds: [lotId],
      parameters,
      stage: "pre_filling",
    });
  expect(res.status).toBe(201);
  return res.body as { id: number; reference: string; amountCents: number };
}

const order = async (id: number) => (await finance.agent.get(B(`/audit-orders/${id}`))).body;
/** An order whose payment has been started, as pressing Pay does: only such an order can be paid. */
async function placeAndStartPayment() {
  const placed = await placeOrder();
  expect((await finance.agent.post(B(`/audit-orders/${placed.id}/checkout`)).set("x-csrf-token", finance.csrf)).status).toBe(200);
  // The PaymentIntent Stripe opened for the session, as Cellarpact keeps it; events for this payment carry it.
  const [row] = await t.sequelize.query<{ pi: string | null }>("SELECT payment_intent_id AS pi FROM audit_orders WHERE id = ?", {
    replacements: [placed.id],
    type: QueryTypes.SELECT,
  });
  return { ...placed, pi: row?.pi ?? undefined };
}
const post = (payload: string, header?: string) =>
  fetch(`${base}/api/webhooks/stripe`, {
    method: "POST",
    headers: { "content-type": "application/json", ...(header ? { "stripe-signature": header } : {}) },
    body: payload,
  });
describe("ordering and paying an audit", () => {
  it("prices the order from the laboratory's list, in integer cents", async () => {
    const labs = await finance.agent.get(B("/laboratories"));
    const northgate = labs.body.find((l: { id: number }) => l.id === ORG.lab);
    const price = (p: string) => northgate.items.find((i: { parameter: string }) => i.parameter === p).priceCents as number;
    const placed = await placeOrder(["volatile_acidity", "free_so2", "alcohol"]);
    expect(placed.amountCents).toBe(price("volatile_acidity") + price("free_so2") + price("alcohol"));
    expect(Number.isInteger(placed.amountCents)).toBe(true);
    const o = await order(placed.id);
    expect(o.status).toBe("awaiting_payment");
    expect(o.actions.pay).toBe(true);
  });

  it("refuses a parameter the laboratory does not price, and lets only finance order", async () => {
    const lotId = await anyLotOfContract(CONTRACT.sentierBlanc);
    const body = {
      idempotencyKey: randomUUID(),
      contractId: CONTRACT.sentierBlanc,
      laboratoryOrgId: ORG.lab,
      lotIds: [lotId],
      parameters: ["cold_stability_deposit"],
      stage: "pre_filling",
    };
    const unpriced = await finance.agent.post(B("/audit-orders")).set("x-csrf-token", finance.csrf).send(body);
    expect(unpriced.status).toBe(400);
    expect(unpriced.body.errors[0].message).toMatch(/does not offer Cold stability/i);
    const tech = await signInAs(t.app, DEMO.buyerTechnologist);
    expect(
      (
        await tech.agent
          .post(B("/audit-orders"))
          .set("x-csrf-token", tech.csrf)
          .send({ ...body, parameters: ["alcohol"] })
      ).status,
    ).toBe(403);
    const other = await signInAs(t.app, DEMO.valsordaQuality);
    const placed = await placeOrder();
    expect((await other.agent.get(`/api/orgs/${ORG.valsorda}/audit-orders/${placed.id}`)).status).toBe(404);
    // The laboratory sees no unpaid order.
    const lab = await signInAs(t.app, DEMO.labAnalyst);
    expect((await lab.agent.get(`/api/orgs/${ORG.lab}/audit-orders/${placed.id}`)).status).toBe(404);
  });

  it("opens one Checkout Session per order however often Pay is pressed", async () => {
    const placed = await placeOrder();
    const sessionsBefore = fake.state.sessions.size;
    const [a, b] = await Promise.all(
      [1, 2].map(() => finance.agent.post(B(`/audit-orders/${placed.id}/checkout`)).set("x-csrf-token", finance.csrf)),
    );
    expect(a!.status).toBe(200);
    expect(b!.status).toBe(200);
    expect(a!.body.url).toBe(b!.body.url);
    const again = await finance.agent.post(B(`/audit-orders/${placed.id}/checkout`)).set("x-csrf-token", finance.csrf);
    expect(again.body.url).toBe(a!.body.url);
    expect(fake.state.sessions.size).toBe(sessionsBefore + 1);
    expect([...fake.state.sessions.values()].at(-1)!.amount_total).toBe(placed.amountCents);
  });

  it("a declined card is recorded as a failure; a good card then pays, with one receipt; a refund comes back through the webhook", async () => {
    const placed = await placeOrder();
    const { url } = (await finance.agent.post(B(`/audit-orders/${placed.id}/checkout`)).set("x-csrf-token", finance.csrf)).body;
    const pay = (card: string) =>
      fetch(url, {
        method: "POST",
        redirect: "manual",
        headers: { "content-type": "application/x-www-form-urlencoded" },
        body: new URLSearchParams({ card, exp: "12 / 34", cvc: "123", name: "Owen Pryce" }),
      });

    const declined = await pay("4000 0000 0000 0002");
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain("Your card was declined.");
    await waitFor("the decline", async () => (await order(placed.id)).status === "payment_failed");
    expect(
      await countOf("SELECT COUNT(*) AS n FROM trail_entries WHERE action = 'payment.failed' AND entity_id = ?", [String(placed.id)]),
    ).toBe(1);

    const paid = await pay("4242 4242 4242 4242");
    expect(paid.status).toBe(303);
    expect(paid.headers.get("location")).toMatch(new RegExp(`/audits/${placed.id}\\?paid=1$`));
    const o = await waitFor("the payment", async () => {
      const x = await order(placed.id);
      return x.status === "paid" && x;
    });
    expect(o.paidCents).toBe(placed.amountCents);
    expect(o.payments.filter((p: { kind: string }) => p.kind === "payment")).toHaveLength(1);
    expect(o.payments.filter((p: { kind: string }) => p.kind === "failure")).toHaveLength(1);
    // checkout.session.completed and payment_intent.succeeded both report it: still one payment.
    const events = fake.state.events
      .filter((e) => (e.data.object as { metadata?: { auditOrderId?: string } }).metadata?.auditOrderId === String(placed.id))
      .map((e) => e.type);
    expect(events).toEqual(
      expect.arrayContaining(["checkout.session.completed", "payment_intent.succeeded", "payment_intent.payment_failed"]),
    );
    await waitFor(
      "every event applied",
      async () => fake.webhooks.attempts.filter((a) => a.status === 200).length >= fake.state.events.length - 2,
    );
    expect(await countOf("SELECT COUNT(*) AS n FROM audit_payments WHERE audit_order_id = ? AND kind = 'payment'", [placed.id])).toBe(1);

    await mail.deliver();
    const receipts = mail.to(DEMO.buyerFinance).filter((m) => m.subject.includes(placed.reference) && m.subject.startsWith("Receipt"));
    expect(receipts).toHaveLength(1);
    expect(receipts[0]!.text).toContain(`/audit-orders/${placed.id}/invoice.pdf`);

    const receipt = await getPdf(finance.agent, B(`/audit-orders/${placed.id}/invoice.pdf`));
    expect(receipt.status).toBe(200);
    const text = receipt.text;
    expect(text).toContain(`Receipt for independent audit ${placed.reference}`);
    expect(text).toContain("Declined attempt");

    const refund = await finance.agent
      .post(B(`/audit-orders/${placed.id}/refund`))
      .set("x-csrf-token", finance.csrf)
      .send({ reason: "Ordered twice by mistake" });
    expect(refund.status).toBe(202);
    const r = await waitFor("the refund", async () => {
      const x = await order(placed.id);
      return x.status === "refunded" && x;
    });
    expect(r.refundedCents).toBe(placed.amountCents);
    expect(
      await countOf(
        "SELECT COUNT(*) AS n FROM trail_entries WHERE action IN ('payment.refunded', 'audit_order.refund_requested') AND entity_id = ?",
        [String(placed.id)],
      ),
    ).toBe(2);
    const second = await finance.agent
      .post(B(`/audit-orders/${placed.id}/refund`))
      .set("x-csrf-token", finance.csrf)
      .send({ reason: "again" });
    expect(second.status).toBe(409);

    // The order's trail, in order, for the buyer only.
    const history = await finance.agent.get(B(`/history/audit_order/${placed.id}`));
    const actions = history.body.map((e: { action: string }) => e.action);
    expect(actions.indexOf("payment.failed")).toBeLessThan(actions.indexOf("payment.succeeded"));
    expect(actions.indexOf("payment.succeeded")).toBeLessThan(actions.indexOf("payment.refunded"));
    expect(actions).toEqual(
      expect.arrayContaining(["audit_order.created", "audit_order.checkout_started", "audit_order.refund_requested"]),
    );
    const lab = await signInAs(t.app, DEMO.labAnalyst);
    expect((await lab.agent.get(`/api/orgs/${ORG.lab}/history/audit_order/${placed.id}`)).status).toBe(404);
  });
});

describe("webhooks", () => {
  it("the same signed event delivered 50 times at once records one payment, one trail entry and one receipt", async () => {
    const placed = await placeAndStartPayment();
    const { payload, header } = signed(succeededEvent(placed.id, placed.amountCents, placed.pi));
    const answers = await Promise.all(Array.from({ length: 50 }, () => post(payload, header)));
    expect(answers.map((a) => a.status)).toEqual(Array(50).fill(200));
    const bodies = await Promise.all(answers.map((a) => a.json()));
    expect(bodies.filter((b) => !b.duplicate)).toHaveLength(1);
    expect(await countOf("SELECT COUNT(*) AS n FROM audit_payments WHERE audit_order_id = ?", [placed.id])).toBe(1);
    expect(
      await countOf("SELECT COUNT(*) AS n FROM trail_entries WHERE action = 'payment.succeeded' AND entity_id = ?", [String(placed.id)]),
    ).toBe(1);
    await mail.deliver();
    expect(mail.to(DEMO.buyerFinance).filter((m) => m.subject.startsWith(`Receipt for audit ${placed.reference}`))).toHaveLength(1);
    expect((await order(placed.id)).status).toBe("paid");
  });

  it("refuses a wrong, stale or missing signature with 400 and records nothing", async () => {
    const placed = await placeAndStartPayment();
    const event = succeededEvent(placed.id, placed.amountCents, placed.pi);
    const before = await countOf("SELECT COUNT(*) AS n FROM stripe_events");
    const good = signed(event);
    const wrongSecret = Stripe.webhooks.generateTestHeaderString({ payload: good.payload, secret: "whsec_someone_else_entirely" });
    const stale = signed(event, Math.floor(Date.now() / 1000) - 301);
    const tampered = good.payload.replace(`"amount":${placed.amountCents}`, `"amount":1`);
    for (const [payload, header] of [
      [good.payload, wrongSecret],
      [stale.payload, stale.header],
      [tampered, good.header],
      [good.payload, undefined],
    ] as const) {
      const res = await post(payload, header);
      expect(res.status).toBe(400);
      expect((await res.json()).detail).toMatch(/signature/i);
    }
    expect(await countOf("SELECT COUNT(*) AS n FROM stripe_events")).toBe(before);
    expect((await order(placed.id)).status).toBe("awaiting_payment");
    // A timestamp 299 s old is still inside the tolerance.
    const fresh = signed(event, Math.floor(Date.now() / 1000) - 299);
    expect((await post(fresh.payload, fresh.header)).status).toBe(200);
  });

  it("refuses a signed event that does not fit its order: another order's payment, a foreign currency, a wrong or negative amount", async () => {
    const placed = await placeAndStartPayment();
    const other = await placeOrder();
    const base = succeededEvent(placed.id, placed.amountCents, placed.pi);
    const variants = [
      // The metadata names this order, but the PaymentIntent is the one Cellarpact created for another order.
      {
        ...base,
        id: `evt_${randomUUID().slice(0, 12)}`,
        data: { object: { ...base.data.object, metadata: { auditOrderId: String(other.id) } } },
      },
      { ...base, id: `evt_${randomUUID().slice(0, 12)}`, data: { object: { ...base.data.object, currency: "usd" } } },
      { ...base, id: `evt_${randomUUID().slice(0, 12)}`, data: { object: { ...base.data.object, amount_received: 1 } } },
      { ...base, id: `evt_${randomUUID().slice(0, 12)}`, data: { object: { ...base.data.object, amount_received: -placed.amountCents } } },
    ];
    for (const event of variants) {
      const { payload, header } = signed(event);
      const res = await post(payload, header);
      expect(res.status).toBe(200);
      expect((await res.json()).outcome).toMatch(/^refused/);
    }
    expect((await order(placed.id)).status).toBe("awaiting_payment");
    expect((await order(other.id)).status).toBe("awaiting_payment");
    expect(await countOf("SELECT COUNT(*) AS n FROM audit_payments WHERE audit_order_id IN (?, ?)", [placed.id, other.id])).toBe(0);
    expect(
      await countOf("SELECT COUNT(*) AS n FROM trail_entries WHERE action = 'payment.event_refused' AND entity_id IN (?, ?)", [
        String(placed.id),
        String(other.id),
      ]),
    ).toBe(4);
  });

  it("answers 400 to a signed event without data, or signed in the future beyond the tolerance", async () => {
    const before = await countOf("SELECT COUNT(*) AS n FROM stripe_events");
    const empty = signed({ id: `evt_${randomUUID().slice(0, 12)}`, object: "event", type: "payment_intent.succeeded" });
    const emptyRes = await post(empty.payload, empty.header);
    expect(emptyRes.status).toBe(400);
    expect((await emptyRes.json()).detail).toMatch(/data object/);
    const placed = await placeAndStartPayment();
    const future = signed(succeededEvent(placed.id, placed.amountCents, placed.pi), Math.floor(Date.now() / 1000) + 301);
    const futureRes = await post(future.payload, future.header);
    expect(futureRes.status).toBe(400);
    expect((await futureRes.json()).detail).toMatch(/future/);
    expect(await countOf("SELECT COUNT(*) AS n FROM stripe_events")).toBe(before);
  });

  it("a refund that arrives before its payment still ends refunded; a late decline never undoes a payment", async () => {
    const placed = await placeAndStartPayment();
    const pi = placed.pi ?? `pi_${randomUUID().replaceAll("-", "")}`;
    const refunded = {
      ...succeededEvent(placed.id, placed.amountCents, pi),
      type: "charge.refunded",
      data: {
        object: {
          id: "ch_x",
          object: "charge",
          payment_intent: pi,
          amount: placed.amountCents,
          amount_refunded: placed.amountCents,
          metadata: { auditOrderId: String(placed.id) },
          refunds: {
            object: "list",
            data: [{ id: `re_${randomUUID().slice(0, 8)}`, object: "refund", amount: placed.amountCents, currency: "eur" }],
          },
        },
      },
    };
    const failed = {
      ...succeededEvent(placed.id, placed.amountCents, pi),
      type: "payment_intent.payment_failed",
      data: {
        object: {
          id: pi,
          object: "payment_intent",
          amount: placed.amountCents,
          metadata: { auditOrderId: String(placed.id) },
          last_payment_error: { charge: "ch_late", message: "Your card was declined." },
        },
      },
    };
    for (const e of [refunded, succeededEvent(placed.id, placed.amountCents, pi), failed]) {
      const s = signed(e);
      expect((await post(s.payload, s.header)).status).toBe(200);
    }
    const o = await order(placed.id);
    expect(o.status).toBe("refunded");
    expect(o.paidCents).toBe(placed.amountCents);
    expect(o.refundedCents).toBe(placed.amountCents);
  });

  it("the fake retries a delivery the app did not acknowledge", async () => {
    const placed = await placeAndStartPayment();
    const { url } = (await finance.agent.post(B(`/audit-orders/${placed.id}/checkout`)).set("x-csrf-token", finance.csrf)).body;
    // Point the fake at a closed port first: every attempt fails until it is pointed back.
    fake.webhooks.point("http://127.0.0.1:9/api/webhooks/stripe");
    const res = await fetch(url, {
      method: "POST",
      redirect: "manual",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ card: "4242424242424242", exp: "12/34", cvc: "123", name: "O P" }),
    });
    expect(res.status).toBe(303);
    await waitFor("a failed attempt", async () => fake.webhooks.attempts.some((a) => a.error !== null));
    // Paid at Stripe but not yet confirmed here: pressing Pay again must not open a second payment.
    const again = await finance.agent.post(B(`/audit-orders/${placed.id}/checkout`)).set("x-csrf-token", finance.csrf);
    expect(again.status).toBe(409);
    expect(again.body.detail).toMatch(/already paid/);
    fake.webhooks.point(`${base}/api/webhooks/stripe`);
    await waitFor("the retried payment", async () => (await order(placed.id)).status === "paid");
    expect(fake.webhooks.attempts.some((a) => a.attempt > 1 && a.status === 200)).toBe(true);
  });
});

describe("the Stripe fake through the SDK", () => {
  it("20 concurrent requests with one idempotency key make one charge; the key with another body is an error", async () => {
    const before = fake.state.charges.length;
    const key = `cellarpact-test-${randomUUID()}`;
    const intents = await Promise.all(
      Array.from({ length: 20 }, () =>
        sdk.paymentIntents.create(
          { amount: 4200, currency: "eur", confirm: true, payment_method: "pm_card_visa" },
          { idempotencyKey: key },
        ),
      ),
    );
    expect(new Set(intents.map((i) => i.id)).size).toBe(1);
    expect(intents[0]!.status).toBe("succeeded");
    expect(fake.state.charges.length).toBe(before + 1);
    await expect(sdk.paymentIntents.create({ amount: 9900, currency: "eur" }, { idempotencyKey: key })).rejects.toBeInstanceOf(
      Stripe.errors.StripeIdempotencyError,
    );
  });

  it("a declined card raises the SDK's card error with Stripe's codes", async () => {
    const err = await sdk.paymentIntents
      .create({ amount: 1500, currency: "eur", confirm: true, payment_method: "pm_card_chargeDeclined" })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect((err as Stripe.errors.StripeCardError).code).toBe("card_declined");
    expect((err as Stripe.errors.StripeCardError).decline_code).toBe("generic_decline");
    expect((err as Stripe.errors.StripeCardError).statusCode).toBe(402);
  });

  it("answers with Stripe's shapes: unknown ids 404 resource_missing, bad keys 401", async () => {
    const missing = await sdk.paymentIntents.retrieve("pi_nope").catch((e: unknown) => e);
    expect((missing as Stripe.errors.StripeError).code).toBe("resource_missing");
    const wrong = new Stripe("sk_live_", { host: "127.0.0.1", port: fake.port, protocol: "http", maxNetworkRetries: 0, telemetry: false });
    const auth = await wrong.paymentIntents.retrieve("pi_nope").catch((e: unknown) => e);
    expect(auth).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
  });
});
