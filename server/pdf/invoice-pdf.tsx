/** Invoice while an audit order is unpaid, receipt once paid: the lines, the payments and refunds Stripe confirmed. */
import { Document, Page, StyleSheet, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { formatMoney, ORDER_STATUS_LABELS } from "../../shared/audits/vocabulary.ts";
import type { AuditOrderDetail } from "../../shared/audits/views.ts";
import { registerPdfFonts } from "./fonts.ts";
import { PageFooter } from "./page-footer.tsx";
import { base, stamp } from "./styles.ts";

const s = { ...base, ...StyleSheet.create({ wide: { width: "46%", paddingRight: 4 }, num: { width: "18%", textAlign: "right" } }) };
const PAYMENT_WORDS = { payment: "Payment received", refund: "Refund", failure: "Declined attempt" } as const;

function InvoiceDocument({ o, generatedAt }: { o: AuditOrderDetail; generatedAt: Date }) {
  const paid = o.paidCents >= o.amountCents;
  const title = paid ? "Receipt" : "Invoice";
  const money = (c: number) => formatMoney(c, o.currency);
  return (
    <Document title={`${title} ${o.reference}`} author="Cellarpact">
      <Page size="A4" style={s.page}>
        <Text style={s.brand}>Cellarpact · {title}</Text>
        <Text style={s.h1}>
          {title} for independent audit {o.reference}
        </Text>
        <Text>
          Billed to: {o.buyerName} (ordered by {o.orderedBy})
        </Text>
        <Text>
          Service: independent analysis by {o.laboratoryName} of {o.wineName} from {o.producerName}, lots {o.lotCodes.join(", ")}
        </Text>
        <Text>
          Ordered {stamp(o.createdAt)} · status: {ORDER_STATUS_LABELS[o.status]}
        </Text>
        <Text style={s.h2}>Lines</Text>
        <View style={s.head}>
          <Text style={s.wide}>Parameter</Text>
          <Text style={s.num}>Price per lot</Text>
          <Text style={s.num}>Lots</Text>
          <Text style={s.num}>Amount</Text>
        </View>
        {o.lines.map((l) => (
          <View key={l.parameter} style={s.row} wrap={false}>
            <Text style={s.wide}>{l.name}</Text>
            <Text style={s.num}>{money(l.unitCents)}</Text>
            <Text style={s.num}>{l.lots}</Text>
            <Text style={s.num}>{money(l.totalCents)}</Text>
          </View>
        ))}
        <View style={s.row}>
          <Text style={[s.wide, { fontWeight: 600 }]}>Total</Text>
          <Text style={s.num} />
          <Text style={s.num} />
          <Text style={[s.num, { fontWeight: 600 }]}>{money(o.amountCents)}</Text>
        </View>
        <Text style={s.h2}>Payments</Text>
        {o.payments.length === 0 && <Text style={s.small}>Nothing received yet. Amount due: {money(o.amountCents)}.</Text>}
        {o.payments.map((p) => (
          <View key={`${p.kind}-${p.stripeRef}`} style={s.row} wrap={false}>
            <Text style={s.wide}>
              {PAYMENT_WORDS[p.kind]} · {stamp(p.at)}
              {p.detail ? ` · ${p.detail}` : ""}
            </Text>
            <Text style={[s.num, { width: "36%" }]}>{p.stripeRef}</Text>
            <Text style={s.num}>{p.kind === "failure" ? "—" : `${p.kind === "refund" ? "-" : ""}${money(p.amountCents)}`}</Text>
          </View>
        ))}
        <View style={s.box}>
          <Text>
            Paid {money(o.paidCents)} · refunded {money(o.refundedCents)} ·{" "}
            {paid ? `balance ${money(o.paidCents - o.refundedCents)} kept` : `due ${money(o.amountCents - o.paidCents)}`}
          </Text>
          <Text style={s.small}>
            Prices are the laboratory's list prices when the order was placed. Taxes, where they apply, are shown on the laboratory's own
            invoice.
          </Text>
        </View>
        <PageFooter label={`${o.reference} · generated ${stamp(generatedAt)}`} />
      </Page>
    </Document>
  );
}

export async function renderInvoice(o: AuditOrderDetail): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(<InvoiceDocument o={o} generatedAt={new Date()} />);
}
