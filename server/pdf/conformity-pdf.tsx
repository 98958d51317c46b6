/**
 * A lot's document: a certificate of conformity, or an analysis statement when the lot's status does
 * not allow one. Both give the parties, the wine, the spec version each analysis was judged against,
 * every result with its uncertainty and verdict, the decision rule, the independent audit's outcome,
 * and the caution that it does not replace an accredited laboratory's report or the market's controls.
 */
import { Document, Page, StyleSheet, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { convert, findParameter, UNITS, type ResultComparison } from "../../shared/engine/index.ts";
import { governingCitations, verdictText } from "../../shared/lots/verdict-text.ts";
import { ANALYSIS_STAGE_LABELS } from "../../shared/lots/vocabulary.ts";
import { CONDITION_LABELS } from "../../shared/deviations/vocabulary.ts";
import type { AnalysisView, LotAuditView, LotDetail, StoredVerdict } from "../../shared/lots/views.ts";
import { registerPdfFonts } from "./fonts.ts";
import { PageFooter } from "./page-footer.tsx";
import { base, stamp } from "./styles.ts";

const s = {
  ...base,
  ...StyleSheet.create({
    p: { width: "24%", paddingRight: 4 },
    r: { width: "22%", paddingRight: 4 },
    l: { width: "36%", paddingRight: 4 },
    v: { width: "18%" },
    c: { width: "20%", paddingRight: 4 },
    statement: { fontSize: 11, fontWeight: 600 },
  }),
};

export interface LotDocumentData {
  /** "certificate" only for a lot whose status allows one; otherwise an analysis statement. */
  kind: "certificate" | "statement";
  number: string;
  lot: LotDetail;
  /** The producer's analyses the status rests on, oldest first. */
  declared: AnalysisView[];
  audit: (LotAuditView & { analysis: AnalysisView | null }) | null;
  issuedBy: { name: string; role: string; organisation: string };
  issuedAt: Date;
}

const name = (p: string) => findParameter(p)?.name ?? p;
const inUnit = (x: number | null, c: ResultComparison) => (x === null ? null : convert(x, c.unit, c.displayUnit));
const num = (x: number | null) => (x === null ? "—" : String(Number(x.toPrecision(3))));

function Results({ verdicts }: { verdicts: StoredVerdict[] }) {
  return (
    <>
      <View style={s.head}>
        <Text style={s.p}>Parameter</Text>
        <Text style={s.r}>Result ± U (k = 2)</Text>
        <Text style={s.l}>Governing limits</Text>
        <Text style={s.v}>Verdict</Text>
      </View>
      {verdicts.map((v) => {
        const t = verdictText(v);
        return (
          <View key={v.parameter} style={s.row} wrap={false}>
            <Text style={s.p}>{name(v.parameter)}</Text>
            <Text style={s.r}>{t.result}</Text>
            <Text style={s.l}>{t.limits}</Text>
            <Text style={s.v}>{v.outcome}</Text>
          </View>
        );
      })}
    </>
  );
}

const TITLES = { certificate: "Certificate of conformity", statement: "Analysis statement" } as const;

function versionText(a: AnalysisView) {
  return a.evaluation?.specVersion
    ? `judged against spec version ${a.evaluation.specVersion.number}`
    : "not judged: no agreed spec version";
}

/**
 * Laid out after what ISO/IEC 17050-1:2004 (corrected 2007-06-15), clause 6.1, asks of a declaration
 * of conformity: its identification, the issuer, the object, the statement, the requirements it
 * refers to, date and place of issue, who validates it, and any limitation on its validity.
 */
function LotDocument({ d }: { d: LotDocumentData }) {
  const { lot, declared, audit } = d;
  const title = TITLES[d.kind];
  const status = lot.status;
  const rules = [
    ...new Set(
      [...declared.flatMap((a) => a.evaluation?.verdicts ?? []), ...(audit?.analysis?.evaluation?.verdicts ?? [])].map((v) => v.ruleText),
    ),
  ];
  const citations = governingCitations([
    ...declared.flatMap((a) => a.evaluation?.verdicts ?? []),
    ...(audit?.analysis?.evaluation?.verdicts ?? []),
  ]);
  const markets = [
    ...new Set(
      [...declared, ...(audit?.analysis ? [audit.analysis] : [])]
        .flatMap((a) => Object.entries(a.evaluation?.marketVersions ?? {}))
        .map(([m, v]) => `${m} (rule pack ${v})`),
    ),
  ];
  return (
    <Document title={`${title} ${d.number}`} author="Cellarpact">
      <Page size="A4" style={s.page}>
        <Text style={s.brand}>Cellarpact · {title}</Text>
        <Text style={s.h1}>
          Lot {lot.lotCode} · {lot.wineName} {lot.vintage}
        </Text>

        <Text style={s.h2}>Identification</Text>
        <Text>
          {title} {d.number}
        </Text>
        <Text>
          Issued on {stamp(d.issuedAt)}, electronically through Cellarpact, by {d.issuedBy.name} ({d.issuedBy.role},{" "}
          {d.issuedBy.organisation}).
        </Text>
        <Text>
          Supplier: {lot.producerName} · Buyer: {lot.contract.retailer.name} · Contract {lot.contractReference}
        </Text>

        <Text style={s.h2}>Object</Text>
        <Text>
          Lot {lot.lotCode} of {lot.wineName}, vintage {lot.vintage}, {lot.contract.wine.colour} {lot.contract.wine.category} wine from{" "}
          {lot.contract.wine.region} · {lot.volumeLitres.toLocaleString("en-GB")} L · for {lot.market}
        </Text>

        <View style={s.box}>
          <Text style={s.statement}>Status: {status.label}</Text>
          <Text>{status.reason}</Text>
          {status.concession && (
            <>
              <Text style={{ marginTop: 4 }}>
                Concession: deviation #{status.concession.deviationId}, decided with the reason "{status.concession.reason}".
              </Text>
              {status.concession.conditions.length ? (
                status.concession.conditions.map((c, i) => (
                  <Text key={i}>
                    · Condition, {CONDITION_LABELS[c.kind].toLowerCase()}: {c.detail}
                  </Text>
                ))
              ) : (
                <Text>· No conditions attached.</Text>
              )}
            </>
          )}
          {d.kind === "statement" && (
            <Text style={{ marginTop: 4 }}>This is not a certificate of conformity: the lot's status does not allow one.</Text>
          )}
        </View>

        <Text style={s.h2}>Requirements referred to</Text>
        <Text>
          {lot.governing
            ? `Specification of contract ${lot.contractReference}, version ${lot.governing.number} (agreed${lot.governing.decidedAt ? ` ${lot.governing.decidedAt.slice(0, 10)}` : ""}), vintages ${lot.governing.vintageFrom}${lot.governing.vintageTo ? `–${lot.governing.vintageTo}` : " onwards"}.`
            : "No agreed specification governs this vintage."}
        </Text>
        <Text>
          Legal limits of the destination market: {markets.join(", ") || lot.market}. The texts the governing legal limits below come from:
        </Text>
        {citations.length ? (
          citations.map((c) => (
            <Text key={c.text} style={s.small}>
              · {c.market}: {c.text}
              {c.unconfirmed ? ` — citation not yet confirmed: ${c.unconfirmed}` : ""}
            </Text>
          ))
        ) : (
          <Text style={s.small}>· none: the buyer's limits are stricter wherever the law sets one.</Text>
        )}

        <Text style={s.h2}>Results declared by the producer</Text>
        {declared.length ? (
          declared.map((a) => (
            <View key={a.id}>
              <Text style={s.small}>
                {ANALYSIS_STAGE_LABELS[a.stage]} · {a.laboratoryName}
                {a.accreditation ? ` (accreditation ${a.accreditation})` : " (not accredited)"} · sampled {a.sampleDate} · {versionText(a)}{" "}
                · engine {a.evaluation?.engineVersion}
              </Text>
              <Results verdicts={a.evaluation?.verdicts ?? []} />
            </View>
          ))
        ) : (
          <Text style={s.small}>No declared analysis.</Text>
        )}

        <Text style={s.h2}>Independent audit</Text>
        {audit?.analysis ? (
          <>
            <Text style={s.small}>
              {audit.reference} · {audit.laboratoryName}
              {audit.analysis.accreditation ? ` (accreditation ${audit.analysis.accreditation})` : ""}
              {audit.reportReference ? ` · report ${audit.reportReference}` : ""} · sampled {audit.analysis.sampleDate}
            </Text>
            <Results verdicts={audit.analysis.evaluation?.verdicts ?? []} />
            {audit.comparisons.some((c) => c.outcome === "discrepant") && (
              <Text style={{ marginTop: 4, fontWeight: 600 }}>
                The independent audit disagrees with the declared results on{" "}
                {audit.comparisons
                  .filter((c) => c.outcome === "discrepant")
                  .map((c) => name(c.parameter))
                  .join(", ")}
                ; see the deviation opened for it.
              </Text>
            )}
            <Text style={[s.small, { marginTop: 6 }]}>
              Agreement with the declared results (ISO 13528 scores, the independent laboratory as reference):
            </Text>
            <View style={s.head}>
              <Text style={s.c}>Parameter</Text>
              <Text style={s.c}>Declared / independent</Text>
              <Text style={s.c}>En</Text>
              <Text style={s.c}>z</Text>
              <Text style={s.c}>Reading</Text>
            </View>
            {audit.comparisons.map((c) => (
              <View key={c.parameter} style={s.row} wrap={false}>
                <Text style={s.c}>{name(c.parameter)}</Text>
                <Text style={s.c}>
                  {num(inUnit(c.declared, c))} / {num(inUnit(c.independent, c))} {UNITS[c.displayUnit]?.label ?? c.displayUnit}
                </Text>
                <Text style={s.c}>{num(c.en)}</Text>
                <Text style={s.c}>{num(c.z)}</Text>
                <Text style={s.c}>{c.outcome}</Text>
              </View>
            ))}
          </>
        ) : (
          <Text style={s.small}>
            {audit ? `${audit.reference} with ${audit.laboratoryName}: results not in yet.` : "No independent audit of this lot."}
          </Text>
        )}

        <Text style={s.h2}>Decision rule</Text>
        <Text>
          The status above covers only the results listed, on the samples analysed. Each result is held against its governing limit, the
          stricter of the buyer's agreed limit and the destination market's legal limit, under the decision rule agreed in the
          specification. The rule decides how measurement uncertainty counts: with a guard band a result passes only when it stays inside
          the limit by the band; a "conditional" verdict (ILAC-G8) means the limit lies within the result's uncertainty interval, so
          conformity is likely but not shown.
        </Text>
        {rules.map((r) => (
          <Text key={r} style={s.small}>
            · {r}
          </Text>
        ))}

        <View style={s.box} wrap={false}>
          <Text style={{ fontWeight: 600 }}>Caution</Text>
          <Text>
            This document summarises results recorded in Cellarpact. It does not replace the test report of an accredited laboratory, nor
            the checks of the destination market's authorities. Legal limits and the sulphite allergen statement follow the law of the
            market of sale; confirm them with the competent authority before release.
          </Text>
        </View>
        <Text style={s.h2}>Limitations</Text>
        <Text>
          Valid for the lot named above and the samples analysed, on the results listed, as they stood on the date of issue. A later
          analysis, a later spec version or a decision on a deviation may change the lot's status; the status shown in Cellarpact is the
          current one.
        </Text>
        <Text style={[s.small, { marginTop: 8 }]}>
          Laid out after ISO/IEC 17050-1:2004 (corrected version 2007-06-15), clause 6.1, on what a declaration of conformity contains: its
          identification, the issuer, the object, the statement, the requirements referred to, the date of issue, who issued it, and the
          limitations on its validity.
        </Text>
        <PageFooter label={`${d.number} · issued ${stamp(d.issuedAt)}`} />
      </Page>
    </Document>
  );
}

export async function renderLotDocument(d: LotDocumentData): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(<LotDocument d={d} />);
}
