/**
 * Signs and delivers events the way Stripe does: a Stripe-Signature header "t=<unix>,v1=<HMAC-SHA256
 * of `${t}.${payload}` with the endpoint secret>", at-least-once, retried with backoff on any
 * non-2xx answer or network error (https://docs.stripe.com/webhooks#verify-manually).
 */
import { createHmac } from "node:crypto";
import type { StripeEventObject } from "./objects.ts";

export function signatureHeader(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac("sha256", secret).update(`${timestamp}.${payload}`).digest("hex");
  return `t=${timestamp},v1=${v1}`;
}

export interface DeliveryAttempt {
  eventId: string;
  attempt: number;
  status: number | null;
  error: string | null;
  at: string;
}

export interface WebhookEndpoint {
  url: string | null;
  secret: string;
  retryBaseMs: number;
  maxAttempts: number;
}

export class WebhookSender {
  attempts: DeliveryAttempt[] = [];
  private timers = new Set<NodeJS.Timeout>();
  private inFlight = new Set<Promise<void>>();

  constructor(private endpoint: WebhookEndpoint) {}

  point(url: string | null) {
    this.endpoint.url = url;
  }

  send(event: StripeEventObject, attempt = 1): void {
    if (!this.endpoint.url) return;
    const p = this.deliver(event, attempt).finally(() => this.inFlight.delete(p));
    this.inFlight.add(p);
  }

  private async deliver(event: StripeEventObject, attempt: number): Promise<void> {
    const payload = JSON.stringify(event, null, 2);
    let status: number | null = null;
    let error: string | null = null;
    try {
      const res = await fetch(this.endpoint.url!, {
        method: "POST",
        headers: {
          "Content-Type": "application/json; charset=utf-8",
          "Stripe-Signature": signatureHeader(payload, this.endpoint.secret),
          "User-Agent": "Stripe/1.0 (+https://stripe.com/docs/webhooks)",
        },
        body: payload,
        signal: AbortSignal.timeout(10_000),
      });
      status = res.status;
      await res.arrayBuffer();
    } catch (err) {
      error = err instanceof Error ? err.message : String(err);
    }
    this.attempts.push({ eventId: event.id, attempt, status, error, at: new Date().toISOString() });
    const delivered = status !== null && status >= 200 && status < 300;
    if (!delivered && attempt < this.endpoint.maxAttempts) {
      const timer = setTimeout(
        () => {
          this.timers.delete(timer);
          this.send(event, attempt + 1);
        },
        this.endpoint.retryBaseMs * 2 ** (attempt - 1),
      );
      this.timers.add(timer);
    }
  }

  async stop(): Promise<void> {
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
    await Promise.allSettled([...this.inFlight]);
  }
}
