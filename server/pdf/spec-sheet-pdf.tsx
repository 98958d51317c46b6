/** The spec sheet as a PDF: version, status, parties, and every requirement with method, decision rule and legal citation. */
import { Document, Page, StyleSheet, Text, View, renderToBuffer } from "@react-pdf/renderer";
import {
  buildRequirement,
  unconfirmedReason,
  findParameter,
  describeRule,
  ruleLabel,
  undeterminedText,
  type AppliedLimit,
  type BuyerRequirement,
} from "../../shared/engine/index.ts";
import { lawFactsText } from "../../shared/specs/law-facts.ts";
import { SEVERITY_LABELS, SPEC_STATUS_LABELS, STAGE_LABELS } from "../../shared/specs/vocabulary.ts";
import type { SpecVersionDetail } from "../../shared/specs/views.ts";
import { wineProfile } from "../../shared/specs/profile.ts";
import { PDF_FONT, registerPdfFonts } from "./fonts.ts";
import { PageFooter } from "./page-footer.tsx";

export type SpecSheetData = Pick<
  SpecVersionDetail,
  "number" | "status" | "title" | "vintageFrom" | "vintageTo" | "stages" | "contract" | "requirements"
> & { generatedAt: Date };

const ink = "#1b2230";
const must = "#5b1f3c";
const line = "#ddd6ca";
const s = StyleSheet.create({
  page: { fontFamily: PDF_FONT as unknown as string, fontSize: 9, color: ink, padding: 36, paddingBottom: 56 },
  brand: { fontSize: 10, fontWeight: 600, color: must },
  h1: { fontSize: 18, fontWeight: 600, marginTop: 4 },
  meta: { flexDirection: "row", flexWrap: "wrap", marginTop: 10, marginBottom: 12 },
  metaItem: { width: "33%", marginBottom: 6 },
  label: { fontSize: 7.5, color: "#5c6470", textTransform: "uppercase" },
  row: { flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: line, paddingVertical: 4 },
  head: { flexDirection: "row", borderBottomWidth: 1, borderBottomColor: ink, paddingBottom: 3, fontWeight: 600 },
  cParam: { width: "19%", paddingRight: 4 },
  cLimits: { width: "15%", paddingRight: 4 },
  cMethod: { width: "12%", paddingRight: 4 },
  cRule: { width: "18%", paddingRight: 4 },
  cSev: { width: "9%", paddingRight: 4 },
  cLaw: { width: "27%" },
  small: { fontSize: 7.5, color: "#384150" },
  caution: { marginTop: 14, padding: 8, borderWidth: 0.5, borderColor: line, fontSize: 8, color: "#384150" },
});

const num = (x: number | null | undefined) => (x === null || x === undefined ? null : String(Number(x.toPrecision(6))));

function limitsText(r: BuyerRequirement): string {
  const lo = num(r.lower);
  const hi = num(r.upper);
  const range = lo && hi ? `${lo} – ${hi}` : hi ? `max ${hi}` : lo ? `min ${lo}` : "absent";
  const target = num(r.target);
  return `${range}${target ? ` (target ${target})` : ""} ${r.unit === "presence" ? "" : r.unit}`.trim();
}

function CitationText({ limit }: { limit: AppliedLimit }) {
  return (
    <Text style={s.small}>
      {limit.citation.document}, {limit.citation.article}
      {unconfirmedReason(limit.confirmed) ? ` — citation not yet confirmed: ${unconfirmedReason(limit.confirmed)}` : ""}
    </Text>
  );
}

function SpecSheet({ d }: { d: SpecSheetData }) {
  const wine = d.contract.wine;
  const profile = wineProfile(wine, d.vintageFrom);
  const vintages = d.vintageTo ? `${d.vintageFrom}–${d.vintageTo}` : `${d.vintageFrom} onwards`;
  return (
    <Document title={`${d.contract.reference} v${d.number} ${wine.name}`} author="Cellarpact" subject="Technical specification">
      <Page size="A4" orientation="landscape" style={s.page}>
        <Text style={s.brand}>Cellarpact · Technical specification</Text>
        <Text style={s.h1}>
          {wine.name} — version {d.number} ({SPEC_STATUS_LABELS[d.status]})
        </Text>
        {d.title ? <Text>{d.title}</Text> : null}
        <View style={s.meta}>
          {[
            ["Contract", d.contract.reference],
            ["Buyer", d.contract.retailer.name],
            ["Producer", d.contract.producer.name],
            ["Wine", `${wine.colour === "rose" ? "rosé" : wine.colour}, ${wine.category}, ${wine.region}`],
            ["Vintages", vintages],
            ["Destination markets", wine.markets.join(", ")],
            ["Facts for the law", lawFactsText(wine.lawFacts ?? {}).join("; ") || "none stated"],
            ["Stages", d.stages.map((x) => STAGE_LABELS[x]).join(", ")],
            ["Requirements", String(d.requirements.length)],
            ["Generated", d.generatedAt.toISOString().slice(0, 16).replace("T", " ") + " UTC"],
          ].map(([k, v]) => (
            <View key={k} style={s.metaItem}>
              <Text style={s.label}>{k}</Text>
              <Text>{v}</Text>
            </View>
          ))}
        </View>
        <View style={s.head} fixed>
          <Text style={s.cParam}>Parameter</Text>
          <Text style={s.cLimits}>Buyer's limits</Text>
          <Text style={s.cMethod}>Method</Text>
          <Text style={s.cRule}>Decision rule</Text>
          <Text style={s.cSev}>Severity</Text>
          <Text style={s.cLaw}>Governing legal limit</Text>
        </View>
        {d.requirements.map((r) => {
          const p = findParameter(r.parameter);
          const req = buildRequirement(r, wine.markets, profile);
          const law = [req.upper, req.lower].find((b) => b?.source.kind === "law");
          const lawLimit = law?.source.kind === "law" ? law.source.limit : undefined;
          const strictest = req.legalLimits[0];
          return (
            <View key={r.parameter} style={s.row} wrap={false}>
              <View style={s.cParam}>
                <Text>{p?.name ?? r.parameter}</Text>
                <Text style={s.small}>{r.stages.map((x) => STAGE_LABELS[x]).join(", ")}</Text>
              </View>
              <Text style={s.cLimits}>{limitsText(r)}</Text>
              <Text style={s.cMethod}>{r.method ?? "—"}</Text>
              <Text style={s.cRule}>{ruleLabel(r.rule)}</Text>
              <Text style={s.cSev}>{SEVERITY_LABELS[r.severity].split(" ")[0]}</Text>
              <View style={s.cLaw}>
                {lawLimit ? (
                  <>
                    <Text>
                      {lawLimit.side} {num(lawLimit.statedValue)} {lawLimit.statedUnit} ({lawLimit.market}) governs
                    </Text>
                    <CitationText limit={lawLimit} />
                  </>
                ) : strictest ? (
                  <>
                    <Text>
                      Law: {strictest.side} {num(strictest.statedValue)} {strictest.statedUnit} ({strictest.market}); buyer's limit is
                      stricter
                    </Text>
                    <CitationText limit={strictest} />
                  </>
                ) : (
                  <Text style={s.small}>No legal limit in the destination markets' packs.</Text>
                )}
                {req.undetermined.map((u) => (
                  <Text key={u.ruleId} style={s.small}>
                    Undetermined: {undeterminedText(u)}
                  </Text>
                ))}
              </View>
            </View>
          );
        })}
        <View style={s.caution} wrap={false}>
          <Text style={{ fontWeight: 600, marginBottom: 2 }}>Decision rules used (ISO/IEC 17025:2017, 7.8.6; ILAC-G8:09/2019)</Text>
          {[...new Map(d.requirements.map((r) => [ruleLabel(r.rule), describeRule(r.rule)])).entries()].map(([label, text]) => (
            <Text key={label}>
              {label}: {text}
            </Text>
          ))}
        </View>
        <Text style={s.caution}>
          Legal limits change. The limits shown come from Cellarpact's market rule packs and are a help, not legal advice: the law of the
          destination market in force at the time of sale prevails, and conformity near a limit should be confirmed by an accredited
          laboratory. Sulphite labelling duties apply above 10 mg/L total SO2 in the EU and from 10 mg/L in the US.
        </Text>
        <PageFooter label={`${d.contract.reference} · version ${d.number} · ${SPEC_STATUS_LABELS[d.status]}`} />
      </Page>
    </Document>
  );
}

export async function renderSpecSheetPdf(d: SpecSheetData): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(<SpecSheet d={d} />);
}
