/** A deviation record: the lot, the results that opened it, the discussion and the decision. */
import { Document, Page, StyleSheet, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { verdictText } from "../../shared/lots/verdict-text.ts";
import type { LotStatus } from "../../shared/lots/lot-status.ts";
import { findParameter } from "../../shared/engine/index.ts";
import { CONDITION_LABELS, DEVIATION_OUTCOME_LABELS, DEVIATION_STATUS_LABELS } from "../../shared/deviations/vocabulary.ts";
import type { DeviationDetail } from "../../shared/deviations/views.ts";
import { registerPdfFonts } from "./fonts.ts";
import { PageFooter } from "./page-footer.tsx";
import { base, stamp } from "./styles.ts";

const s = {
  ...base,
  ...StyleSheet.create({
    cell: { width: "25%", paddingRight: 4 },
    message: { marginBottom: 6, paddingLeft: 6, borderLeftWidth: 2, borderLeftColor: "#ddd6ca" },
  }),
};

function Record({ d, lotStatus, generatedAt }: { d: DeviationDetail; lotStatus: LotStatus; generatedAt: Date }) {
  return (
    <Document title={`Deviation ${d.id}`} author="Cellarpact">
      <Page size="A4" style={s.page}>
        <Text style={s.brand}>Cellarpact · Deviation record</Text>
        <Text style={s.h1}>
          Deviation #{d.id} — lot {d.lotCode} ({DEVIATION_STATUS_LABELS[d.status]})
        </Text>
        <Text>
          {d.wineName}, vintage {d.vintage} · contract {d.contractReference} · producer {d.producerName}
        </Text>
        <Text>
          Opened {d.createdAt.slice(0, 16).replace("T", " ")} UTC ({d.kind}): {d.summary}
        </Text>
        <Text style={{ marginTop: 4, fontWeight: 600 }}>
          Lot status: {lotStatus.label}. {lotStatus.reason}
        </Text>
        <Text style={s.h2}>Results that opened it</Text>
        {d.verdicts.length === 0 ? (
          <Text style={s.small}>Opened by hand or from a transit comparison; see the summary above.</Text>
        ) : (
          d.verdicts.map((v) => (
            <View key={v.parameter} style={s.row} wrap={false}>
              <Text style={s.cell}>{findParameter(v.parameter)?.name ?? v.parameter}</Text>
              <Text style={s.cell}>{verdictText(v).result}</Text>
              <Text style={s.cell}>{v.outcome}</Text>
              <Text style={[s.cell, s.small]}>{v.explanation}</Text>
            </View>
          ))
        )}
        <Text style={s.h2}>Discussion</Text>
        {d.messages.length === 0 && <Text style={s.small}>No message.</Text>}
        {d.messages.map((m) => (
          <View key={m.id} style={s.message} wrap={false}>
            <Text style={s.small}>
              {m.createdAt.slice(0, 16).replace("T", " ")} UTC · {m.author}, {m.organisation} · {m.kind}
              {m.parentId ? ` (reply to #${m.parentId})` : ""}
              {m.editedAt ? " · edited" : ""}
            </Text>
            {m.proposal && (
              <Text>
                {DEVIATION_OUTCOME_LABELS[m.proposal.outcome]}
                {m.proposal.conditions.length
                  ? ` — ${m.proposal.conditions.map((c) => `${CONDITION_LABELS[c.kind]}: ${c.detail}`).join("; ")}`
                  : ""}
              </Text>
            )}
            {m.quote && (
              <Text style={s.small}>
                Quoted: {findParameter(m.quote.parameter)?.name} {m.quote.resultText} ({m.quote.outcome})
              </Text>
            )}
            <Text>{m.body}</Text>
          </View>
        ))}
        <Text style={s.h2}>Decision</Text>
        {d.decision ? (
          <>
            <Text>
              {DEVIATION_OUTCOME_LABELS[d.decision.outcome]} — decided by {d.decidedBy} on {d.decidedAt?.slice(0, 10)}
            </Text>
            {d.decision.conditions.map((c, i) => (
              <Text key={i}>
                {CONDITION_LABELS[c.kind]}: {c.detail}
              </Text>
            ))}
            <Text>Reason: {d.decision.reason}</Text>
          </>
        ) : (
          <Text style={s.small}>Not decided yet.</Text>
        )}
        <PageFooter label={`Deviation #${d.id} · generated ${stamp(generatedAt)}`} />
      </Page>
    </Document>
  );
}

export async function renderDeviationRecord(d: DeviationDetail, lotStatus: LotStatus): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(<Record d={d} lotStatus={lotStatus} generatedAt={new Date()} />);
}
