/**
 * Certificate of conformity for one lot: the parties, the wine, the governing spec version, every result
 * with its uncertainty and verdict, the decision rule applied, the independent audit's outcome, and the
 * caution that it does not replace an accredited laboratory's report or the market's own controls.
 */
import { Document, Page, StyleSheet, Text, View, renderToBuffer } from "@react-pdf/renderer";
import { convert, findParameter, UNITS, type ResultComparison } from "../../shared/engine/index.ts";
import { verdictText } from "../../shared/lots/verdict-text.ts";
import { ANALYSIS_STAGE_LABELS } from "../../shared/lots/vocabulary.ts";
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

export interface ConformityData {
  number: string;
  lot: LotDetail;
  declared: AnalysisView | null;
  audit: (LotAuditView & { analysis: AnalysisView | null }) | null;
  statement: string;
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

function Certificate({ d, generatedAt }: { d: ConformityData; generatedAt: Date }) {
  const { lot, declared, audit } = d;
  const rules = [...new Set([...(declared?.evaluation?.verdicts ?? []), ...(audit?.analysis?.evaluation?.verdicts ?? [])].map((v) => v.ruleText))];
  return (
    <Document title={`Certificate of conformity ${d.number}`} author="Cellarpact">
      <Page size="A4" style={s.page}>
        <Text style={s.brand}>Cellarpact · Certificate of conformity</Text>
        <Text style={s.h1}>
          Lot {lot.lotCode} · {lot.wineName} {lot.vintage}
        </Text>
        <Text>Certificate {d.number}</Text>
        <Text>
          Buyer: {lot.contract.retailer.name} · Producer: {lot.producerName} · Contract {lot.contractReference}
        </Text>
        <Text>
          Destination market: {lot.market} · Volume: {lot.volumeLitres.toLocaleString("en-GB")} L
        </Text>
        <Text>{lot.governing ? `Specification: version ${lot.governing.number} (agreed), vintages ${lot.governing.vintageFrom}${lot.governing.vintageTo ? `–${lot.governing.vintageTo}` : " onwards"}` : "No agreed specification governs this lot; results are judged against legal limits only."}</Text>

        <View style={s.box}>
          <Text style={s.statement}>{d.statement}</Text>
        </View>

        <Text style={s.h2}>Results declared by the producer</Text>
        {declared ? (
          <>
            <Text style={s.small}>
              {ANALYSIS_STAGE_LABELS[declared.stage]} · {declared.laboratoryName}
              {declared.accreditation ? ` (accreditation ${declared.accreditation})` : ""} · sampled {declared.sampleDate} · engine {declared.evaluation?.engineVersion}
            </Text>
            <Results verdicts={declared.evaluation?.verdicts ?? []} />
          </>
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
            <Text style={[s.small, { marginTop: 6 }]}>Agreement with the declared results (ISO 13528 scores, the independent laboratory as reference):</Text>
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
          <Text style={s.small}>{audit ? `${audit.reference} with ${audit.laboratoryName}: results not in yet.` : "No independent audit of this lot."}</Text>
        )}

        <Text style={s.h2}>Decision rule</Text>
        <Text>
          The statement above covers only the results listed, on the samples analysed. Each result is held against its governing limit, the stricter of the buyer's agreed limit and the destination
          market's legal limit, under the decision rule agreed in the specification. The rule decides how measurement uncertainty counts: with a guard band a result passes only when it stays inside the
          limit by the band; a "conditional" verdict (ILAC-G8) means the limit lies within the result's uncertainty interval, so conformity is likely but not shown.
        </Text>
        {rules.map((r) => (
          <Text key={r} style={s.small}>
            · {r}
          </Text>
        ))}

        <View style={s.box} wrap={false}>
          <Text style={{ fontWeight: 600 }}>Caution</Text>
          <Text>
            This certificate summarises results recorded in Cellarpact. It does not replace the test report of an accredited laboratory, nor the checks of the destination market's authorities. Legal
            limits and the sulphite allergen statement follow the law of the market of sale; confirm them with the competent authority before release.
          </Text>
        </View>
        <PageFooter label={`${d.number} · generated ${stamp(generatedAt)}`} />
      </Page>
    </Document>
  );
}

export async function renderConformityCertificate(d: ConformityData): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(<Certificate d={d} generatedAt={new Date()} />);
}
