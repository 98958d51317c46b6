/** Wording of the payment mails: a receipt when Stripe confirms a payment, a note when it confirms a refund. */
import { formatMoney } from "../../../shared/audits/vocabulary.ts";
import type { OutgoingMail } from "./outbox.ts";

interface OrderMailFacts {
  to: string;
  name: string;
  reference: string;
  wine: string;
  laboratory: string;
  amountCents: number;
  currency: string;
  paymentRef: string;
  link: string;
  pdfLink: string;
}

export function receiptMail(p: OrderMailFacts): OutgoingMail {
  return {
    to: p.to,
    subject: `Receipt for audit ${p.reference}: ${formatMoney(p.amountCents, p.currency)} paid`,
    text: [
      `Hello ${p.name},`,
      ``,
      `We received ${formatMoney(p.amountCents, p.currency)} for the independent audit ${p.reference} (${p.wine}, analysed by ${p.laboratory}).`,
      `Payment reference: ${p.paymentRef}`,
      ``,
      `The laboratory has been told and will send its results through Cellarpact.`,
      `Order: ${p.link}`,
      `Receipt (PDF): ${p.pdfLink}`,
    ].join("\n"),
  };
}

export function refundMail(p: OrderMailFacts): OutgoingMail {
  return {
    to: p.to,
    subject: `Refund for audit ${p.reference}: ${formatMoney(p.amountCents, p.currency)}`,
    text: [
      `Hello ${p.name},`,
      ``,
      `${formatMoney(p.amountCents, p.currency)} was refunded for the audit ${p.reference} (${p.wine}).`,
      `Refund reference: ${p.paymentRef}`,
      `Your bank may take a few days to show it.`,
      ``,
      `Order: ${p.link}`,
      `Receipt (PDF): ${p.pdfLink}`,
    ].join("\n"),
  };
}
