/**
 * A local stand-in for the part of Stripe's API that Cellarpact uses, spoken in Stripe's own request
 * and response shapes so that the real stripe SDK can talk to it: PaymentIntents (create, retrieve,
 * confirm), Checkout Sessions (create, retrieve, hosted page), Refunds, idempotency keys, card
 * declines, and signed webhook events with retries. /__fake/* lets tests see what it did.
 */
import express, { type Request, type Response, type NextFunction } from "express";
import http from "node:http";
import { createHash } from "node:crypto";
import type { AddressInfo } from "node:net";
import {
  FakeState,
  TEST_CARDS,
  TEST_PAYMENT_METHODS,
  newId,
  type CheckoutSession,
  type PaymentError,
  type PaymentIntent,
} from "./objects.ts";
import { WebhookSender, type WebhookEndpoint } from "./webhooks.ts";
import { paymentPage } from "./payment-page.ts";

export interface StripeFakeOptions {
  port?: number;
  host?: string;
  webhook?: Partial<WebhookEndpoint>;
}

export interface StripeFake {
  port: number;
  url: string;
  state: FakeState;
  webhooks: WebhookSender;
  stop(): Promise<void>;
}

class ApiError extends Error {
  constructor(
    public status: number,
    public body: Record<string, unknown>,
  ) {
    super(String(body.message));
  }
}
const invalid = (message: string, param?: string) =>
  new ApiError(400, { type: "invalid_request_error", message, ...(param ? { param } : {}) });
const missing = (kind: string, id: string) =>
  new ApiError(404, { type: "invalid_request_error", code: "resource_missing", message: `No such ${kind}: '${id}'`, param: "id" });

const int = (v: unknown, param: string) => {
  const n = typeof v === "string" && /^\d+$/.test(v) ? Number(v) : NaN;
  if (!Number.isSafeInteger(n)) throw invalid(`Invalid integer: ${String(v ?? "")}`, param);
  return n;
};
const metadataOf = (v: unknown): Record<string, string> =>
  v && typeof v === "object" ? Object.fromEntries(Object.entries(v as Record<string, unknown>).map(([k, x]) => [k, String(x)])) : {};
const listOf = (v: unknown): Record<string, unknown>[] =>
  (Array.isArray(v) ? v : v && typeof v === "object" ? Object.values(v) : []) as Record<string, unknown>[];

export async function startStripeFake(opts: StripeFakeOptions = {}): Promise<StripeFake> {
  const state = new FakeState();
  const webhooks = new WebhookSender({ url: null, secret: "whsec_local", retryBaseMs: 1000, maxAttempts: 6, ...opts.webhook });
  /** Saved answers by idempotency key, with a hash of the request they answered (Stripe keeps them 24 h). */
  const saved = new Map<string, { requestHash: string; status: number; body: unknown }>();
  let baseUrl = "";

  const app = express();
  app.disable("x-powered-by");
  app.use(express.urlencoded({ extended: true, limit: "100kb" }));

  app.use("/v1", (req: Request, _res: Response, next: NextFunction) => {
    const auth = req.get("authorization") ?? "";
    if (!/^Bearer sk_test_\w+$/.test(auth))
      return next(new ApiError(401, { type: "invalid_request_error", message: "Invalid API Key provided." }));
    next();
  });

  // Idempotency: the first answer for a key is saved and replayed; another request under the same key is an error.
  // Handlers below are synchronous, so concurrent requests with one key cannot both get past this check.
  app.use("/v1", (req: Request, res: Response, next: NextFunction) => {
    const key = req.get("idempotency-key");
    if (req.method !== "POST" || !key) return next();
    if (key.length > 255) return next(invalid("Idempotency keys can be at most 255 characters long."));
    const requestHash = createHash("sha256")
      .update(`${req.method} ${req.path} ${JSON.stringify(req.body)}`)
      .digest("hex");
    const earlier = saved.get(key);
    if (earlier) {
      if (earlier.requestHash !== requestHash) {
        return next(
          new ApiError(400, {
            type: "idempotency_error",
            message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
          }),
        );
      }
      res.setHeader("Idempotent-Replayed", "true");
      return res.status(earlier.status).json(earlier.body);
    }
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      saved.set(key, { requestHash, status: res.statusCode, body });
      return json(body);
    };
    res.setHeader("Idempotency-Key", key);
    next();
  });

  const findIntent = (id: string) =>
    state.paymentIntents.get(id) ??
    (() => {
      throw missing("payment_intent", id);
    })();
  const findSession = (id: string) =>
    state.sessions.get(id) ??
    (() => {
      throw missing("checkout.session", id);
    })();
  const emit = (type: string, object: unknown, req?: Request) =>
    webhooks.send(state.event(type, object, req?.get("idempotency-key") ?? null));

  /** Charges the intent; a decline leaves it awaiting another payment method, as Stripe does. */
  function pay(pi: PaymentIntent, method: string, failure: PaymentError | null, req?: Request): PaymentError | null {
    if (pi.status === "succeeded") throw invalid("This PaymentIntent's payment has already succeeded.", "payment_intent");
    pi.payment_method = method;
    const charge = state.charge(pi, failure);
    if (failure) {
      pi.status = "requires_payment_method";
      pi.last_payment_error = { ...failure, charge: charge.id };
      emit("payment_intent.payment_failed", pi, req);
      return pi.last_payment_error;
    }
    pi.status = "succeeded";
    pi.amount_received = pi.amount;
    pi.last_payment_error = null;
    const session = [...state.sessions.values()].find((s) => s.payment_intent === pi.id);
    if (session) {
      session.status = "complete";
      session.payment_status = "paid";
      session.url = null;
      emit("checkout.session.completed", session, req);
    }
    emit("charge.succeeded", charge, req);
    emit("payment_intent.succeeded", pi, req);
    return null;
  }

  function confirm(pi: PaymentIntent, method: unknown, req: Request) {
    if (typeof method !== "string" || !(method in TEST_PAYMENT_METHODS))
      throw invalid(`No such PaymentMethod: '${String(method ?? "")}'`, "payment_method");
    const error = pay(pi, method, TEST_PAYMENT_METHODS[method]!, req);
    if (error) throw new ApiError(402, { ...error, payment_intent: pi, doc_url: "https://docs.stripe.com/error-codes/card-declined" });
    return pi;
  }

  app.post("/v1/payment_intents", (req, res) => {
    const b = req.body as Record<string, unknown>;
    const amount = int(b.amount, "amount");
    if (amount < 50) throw invalid("Amount must be at least 50 cents.", "amount");
    if (typeof b.currency !== "string" || !/^[a-z]{3}$/.test(b.currency)) throw invalid("Missing required param: currency.", "currency");
    const pi = state.createPaymentIntent({
      amount,
      currency: b.currency,
      metadata: metadataOf(b.metadata),
      description: (b.description as string) ?? null,
      receiptEmail: (b.receipt_email as string) ?? null,
    });
    emit("payment_intent.created", pi, req);
    res.json(b.confirm === "true" ? confirm(pi, b.payment_method, req) : pi);
  });
  app.get("/v1/payment_intents/:id", (req, res) => void res.json(findIntent(req.params.id)));
  app.post(
    "/v1/payment_intents/:id/confirm",
    (req, res) => void res.json(confirm(findIntent(req.params.id), (req.body as Record<string, unknown>).payment_method, req)),
  );

  app.post("/v1/checkout/sessions", (req, res) => {
    const b = req.body as Record<string, unknown>;
    if (b.mode !== "payment") throw invalid("Only mode=payment is supported by this test server.", "mode");
    if (typeof b.success_url !== "string") throw invalid("Missing required param: success_url.", "success_url");
    const items = listOf(b.line_items).map((li, i) => {
      const pd = (li.price_data ?? {}) as Record<string, unknown>;
      return {
        name: String((pd.product_data as Record<string, unknown> | undefined)?.name ?? `Item ${i + 1}`),
        amount: int(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`),
        quantity: int(li.quantity ?? "1", `line_items[${i}][quantity]`),
        currency: String(pd.currency ?? ""),
      };
    });
    if (!items.length) throw invalid("Missing required param: line_items.", "line_items");
    const currency = items[0]!.currency;
    if (!/^[a-z]{3}$/.test(currency) || items.some((i) => i.currency !== currency))
      throw invalid("All line items need the same three-letter currency.", "line_items");
    const total = items.reduce((s, i) => s + i.amount * i.quantity, 0);
    const piData = (b.payment_intent_data ?? {}) as Record<string, unknown>;
    const metadata = metadataOf(b.metadata);
    const pi = state.createPaymentIntent({
      amount: total,
      currency,
      metadata: { ...metadata, ...metadataOf(piData.metadata) },
      description: (piData.description as string) ?? null,
      receiptEmail: (b.customer_email as string) ?? null,
    });
    const id = newId("cs_test");
    const session: CheckoutSession = {
      id,
      object: "checkout.session",
      mode: "payment",
      status: "open",
      payment_status: "unpaid",
      amount_total: total,
      currency,
      client_reference_id: (b.client_reference_id as string) ?? null,
      customer_email: (b.customer_email as string) ?? null,
      metadata,
      payment_intent: pi.id,
      success_url: b.success_url,
      cancel_url: (b.cancel_url as string) ?? null,
      url: `${baseUrl}/pay/${id}`,
      line_items_summary: items.map(({ name, amount, quantity }) => ({ name, amount, quantity })),
      created: Math.floor(Date.now() / 1000),
      livemode: false,
    };
    state.sessions.set(id, session);
    res.json(session);
  });
  app.get("/v1/checkout/sessions/:id", (req, res) => void res.json(findSession(req.params.id)));

  app.post("/v1/refunds", (req, res) => {
    const b = req.body as Record<string, unknown>;
    const pi = findIntent(String(b.payment_intent ?? ""));
    const charge = state.charges.find((c) => c.id === pi.latest_charge && c.status === "succeeded");
    if (!charge) throw invalid(`This PaymentIntent (${pi.id}) does not have a successful charge to refund.`, "payment_intent");
    const left = charge.amount - charge.amount_refunded;
    const amount = b.amount === undefined ? left : int(b.amount, "amount");
    if (amount <= 0 || amount > left)
      throw invalid(`Refund amount (${amount}) is greater than unrefunded amount on charge (${left}).`, "amount");
    const refund = state.refund(charge, amount, (b.reason as string) ?? null);
    emit("charge.refunded", charge, req);
    res.json(refund);
  });

  // The hosted payment page (what a Checkout Session's url opens).
  app.get("/pay/:id", (req, res) => {
    const s = state.sessions.get(req.params.id);
    if (!s) return void res.status(404).type("text").send("No such payment session.");
    res.type("html").send(paymentPage(s));
  });
  app.post("/pay/:id", (req, res) => {
    const s = state.sessions.get(req.params.id);
    if (!s) return void res.status(404).type("text").send("No such payment session.");
    if (s.status !== "open") return void res.type("html").send(paymentPage(s));
    const card = String((req.body as Record<string, unknown>).card ?? "").replace(/\D/g, "");
    if (!(card in TEST_CARDS))
      return void res
        .status(400)
        .type("html")
        .send(paymentPage(s, "Your card number is incorrect. Use one of the test card numbers below."));
    const error = pay(findIntent(s.payment_intent), `pm_card_${card.slice(-4)}`, TEST_CARDS[card]!);
    if (error) return void res.status(402).type("html").send(paymentPage(s, error.message));
    res.redirect(303, s.success_url.replace("{CHECKOUT_SESSION_ID}", s.id));
  });

  // What the fake did, for tests and for the curious: charges, events and webhook delivery attempts.
  app.get("/__fake/charges", (_req, res) => void res.json(state.charges));
  app.get("/__fake/events", (_req, res) => void res.json({ events: state.events, deliveries: webhooks.attempts }));

  app.use((req: Request, _res: Response, next: NextFunction) =>
    next(new ApiError(404, { type: "invalid_request_error", message: `Unrecognized request URL (${req.method}: ${req.path}).` })),
  );
  app.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    if (err instanceof ApiError) return void res.status(err.status).json({ error: err.body });
    res.status(500).json({ error: { type: "api_error", message: err instanceof Error ? err.message : "Internal error" } });
  });

  const server = http.createServer(app);
  await new Promise<void>((resolve) => server.listen(opts.port ?? 0, opts.host ?? "127.0.0.1", resolve));
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${opts.host ?? "127.0.0.1"}:${port}`;
  return {
    port,
    url: baseUrl,
    state,
    webhooks,
    async stop() {
      await webhooks.stop();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
