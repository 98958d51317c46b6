/** The hosted payment page of the fake: a plain form that takes one of Stripe's test card numbers. */
import type { CheckoutSession } from "./objects.ts";

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
const money = (cents: number, currency: string) =>
  new Intl.NumberFormat("en-GB", { style: "currency", currency: currency.toUpperCase() }).format(cents / 100);

export function paymentPage(s: CheckoutSession, error?: string): string {
  const lines = s.line_items_summary
    .map(
      (l) =>
        `<tr><td>${escape(l.name)}</td><td class="n">${l.quantity} ×</td><td class="n">${money(l.amount * l.quantity, s.currency)}</td></tr>`,
    )
    .join("");
  const body =
    s.status === "open"
      ? `<form method="post" action="/pay/${escape(s.id)}">
  ${error ? `<p role="alert" class="err">${escape(error)}</p>` : ""}
  <label for="card">Card number</label>
  <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required placeholder="4242 4242 4242 4242">
  <div class="row">
    <div><label for="exp">Expiry (MM / YY)</label><input id="exp" name="exp" required placeholder="12 / 34"></div>
    <div><label for="cvc">CVC</label><input id="cvc" name="cvc" required placeholder="123"></div>
  </div>
  <label for="name">Name on card</label>
  <input id="name" name="name" autocomplete="cc-name" required>
  <button type="submit">Pay ${money(s.amount_total, s.currency)}</button>
  <p class="hint">Test payments only. 4242 4242 4242 4242 succeeds; 4000 0000 0000 0002 is declined.</p>
</form>
${s.cancel_url ? `<p><a href="${escape(s.cancel_url)}">Cancel and go back</a></p>` : ""}`
      : `<p>This payment session is ${escape(s.status)}.</p><p><a href="${escape(s.success_url.replace("{CHECKOUT_SESSION_ID}", s.id))}">Return to the merchant</a></p>`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Test payment</title>
<style>
body{font:16px/1.5 system-ui,sans-serif;background:#f4f4f5;color:#18181b;margin:0}
main{max-width:28rem;margin:3rem auto;background:#fff;border:1px solid #d4d4d8;border-radius:8px;padding:1.5rem 2rem}
h1{font-size:1.25rem;margin:0 0 .25rem} .sub{color:#52525b;margin:0 0 1rem}
table{width:100%;border-collapse:collapse;margin-bottom:1rem} td{padding:.25rem 0;border-bottom:1px solid #e4e4e7} .n{text-align:right}
label{display:block;font-weight:600;margin-top:.75rem} input{width:100%;box-sizing:border-box;padding:.5rem;border:1px solid #71717a;border-radius:4px;font:inherit}
.row{display:flex;gap:1rem} .row>div{flex:1}
button{margin-top:1.25rem;width:100%;padding:.6rem;border:0;border-radius:4px;background:#1e3a8a;color:#fff;font:inherit;font-weight:600;cursor:pointer}
.err{background:#fef2f2;border:1px solid #b91c1c;color:#7f1d1d;padding:.5rem;border-radius:4px} .hint{color:#52525b;font-size:.875rem}
</style></head>
<body><main>
<h1>Test payment</h1>
<p class="sub">Local payment test server — no real money moves.</p>
<table><tbody>${lines}<tr><td><strong>Total</strong></td><td></td><td class="n"><strong>${money(s.amount_total, s.currency)}</strong></td></tr></tbody></table>
${body}
</main></body></html>`;
}
