/**
 * Great Britain: wine placed on the market in England, Scotland and Wales, under the EU wine rules as
 * they were retained and stand in GB law (the revised texts on legislation.gov.uk). The values are
 * the EU pack's for the rules GB kept; the citations name the retained texts. Contaminant limits are
 * not in this pack yet: GB did not take over Reg. (EU) 2023/915.
 */
import type { Citation } from "../labelling.ts";
import type { LegalLimitRule, MarketPack, WineProfile } from "./types.ts";
import { EU_PACK } from "./eu.ts";

/** An EU text as Great Britain kept it: the citation names the retained text and where its revised version is read. */
export const retainedInGb = (c: Citation): Citation => ({
  ...c,
  document: `${c.document} as retained in the law of Great Britain`,
  edition: "revised text on legislation.gov.uk",
});

// The Member States' volatile acidity derogations and the EU organic rules (2018/848, 2021/1165) are not GB law; contaminants are not in this pack yet.
const KEPT = /^eu-(so2|va-(white|red)$|ta-|alcohol-|overpressure-|citric-|sorbic-)/;

const rules: LegalLimitRule[] = EU_PACK.rules
  .filter((r) => KEPT.test(r.id))
  .map((r) => ({
    ...r,
    id: r.id.replace(/^eu-/, "gb-"),
    citation: retainedInGb(r.citation),
    // The derogations that lift the EU volatile acidity limits are the Member States' and bind nothing in GB.
    ...(r.parameter === "volatile_acidity" ? { applies: (p: WineProfile) => (r.id === "eu-va-red") === (p.colour === "red") } : {}),
    // The SO2 points were read in the GB revised text itself; the rest keep the EU pack's notes.
    confirmed:
      /^eu-so2-(red|white)-/.test(r.id) || r.id === "eu-so2-derogation-300"
        ? "read in the source (legislation.gov.uk revised text of 2019/934, Annex I Part B, A.1 and A.2)"
        : r.confirmed,
  }));

export const GB_PACK: MarketPack = {
  id: "GB",
  name: "Great Britain (wine placed on the market)",
  version: "2026.2",
  edition: "Retained EU wine law as revised on legislation.gov.uk, read for Cellarpact in December 2026",
  rules,
};
