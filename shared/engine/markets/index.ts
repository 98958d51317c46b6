/** The market rule packs and the question each answers: which limits apply to this wine, and why. */
import { convert } from "../units.ts";
import { parameter, type ParameterId } from "../parameters.ts";
import type { Citation } from "../labelling.ts";
import { PROFILE_FACT_LABELS, type LegalLimitRule, type MarketId, type MarketPack, type WineProfile } from "./types.ts";
import { EU_PACK } from "./eu.ts";
import { US_PACK } from "./us.ts";
import { OIV_PACK } from "./oiv.ts";
import { CA_ON_PACK, CN_PACK, UK_QWS_PACK } from "./other.ts";
import { GB_PACK } from "./gb.ts";
import { AU_NZ_PACK } from "./au-nz.ts";

export const MARKET_PACKS: Record<MarketId, MarketPack> = {
  EU: EU_PACK,
  GB: GB_PACK,
  US: US_PACK,
  OIV: OIV_PACK,
  "AU-NZ": AU_NZ_PACK,
  "UK-QWS": UK_QWS_PACK,
  CN: CN_PACK,
  "CA-ON": CA_ON_PACK,
};

export const MARKET_IDS = Object.keys(MARKET_PACKS) as MarketId[];

/** A legal limit that applies, already converted to the parameter's canonical unit. */
export interface AppliedLimit {
  market: MarketId;
  marketName: string;
  packVersion: string;
  ruleId: string;
  parameter: ParameterId;
  side: "max" | "min";
  /** In the parameter's canonical unit. */
  value: number;
  /** As the law writes it. */
  statedValue: number;
  statedUnit: string;
  condition: string;
  citation: Citation;
  confirmed: string;
}

export interface UndeterminedLimit {
  market: MarketId;
  ruleId: string;
  parameter: ParameterId;
  condition: string;
  missing: (keyof WineProfile)[];
}

/** A rule that may apply, in words that name the facts it needs. */
export const undeterminedText = (u: UndeterminedLimit) =>
  `A ${u.market} limit (${u.condition}) may apply; it needs the wine's ${u.missing.map((m) => PROFILE_FACT_LABELS[m]).join(" and ")}.`;

function toApplied(pack: MarketPack, rule: LegalLimitRule, densityGPerMl?: number): AppliedLimit {
  const canonical = parameter(rule.parameter).unit;
  return {
    market: pack.id,
    marketName: pack.name,
    packVersion: pack.version,
    ruleId: rule.id,
    parameter: rule.parameter,
    side: rule.side,
    value: convert(rule.value, rule.unit, canonical, { densityGPerMl }),
    statedValue: rule.value,
    statedUnit: rule.unit,
    condition: rule.condition,
    citation: rule.citation,
    confirmed: rule.confirmed,
  };
}

/**
 * Which limits of these markets apply to this wine. Rules that need a profile field the caller did
 * not give are listed as undetermined, never guessed. mg/kg limits use the wine's density (1.000 g/mL
 * when unknown, stated in the result).
 */
/** A market with no rule pack: refused by name rather than judged as if it had no law. */
export class MarketError extends Error {
  constructor(readonly market: string) {
    super(`"${market}" is not a market Cellarpact has rules for; choose one of ${Object.keys(MARKET_PACKS).join(", ")}.`);
  }
}

export function applicableLimits(
  markets: readonly MarketId[],
  profile: WineProfile,
  opts: { parameter?: ParameterId; densityGPerMl?: number } = {},
): { limits: AppliedLimit[]; undetermined: UndeterminedLimit[] } {
  const limits: AppliedLimit[] = [];
  const undetermined: UndeterminedLimit[] = [];
  for (const id of markets) {
    const pack = MARKET_PACKS[id];
    if (!pack) throw new MarketError(id);
    for (const rule of pack.rules) {
      if (opts.parameter && rule.parameter !== opts.parameter) continue;
      const a = rule.applies(profile);
      if (a === true) limits.push(toApplied(pack, rule, opts.densityGPerMl));
      else if (a !== false)
        undetermined.push({ market: id, ruleId: rule.id, parameter: rule.parameter, condition: rule.condition, missing: a.missing });
    }
  }
  return { limits, undetermined };
}

export type { MarketId, MarketPack, WineProfile } from "./types.ts";

/** A rule's citation has been read in the published text itself, not only in a secondary source. */
export const citationConfirmed = (confirmed: string | undefined) => !!confirmed && confirmed.startsWith("read in the source");

/** Why a citation is not confirmed yet, for the words "citation not yet confirmed: …" on screens and documents; null once confirmed. */
export const unconfirmedReason = (confirmed: string | undefined): string | null =>
  !confirmed || citationConfirmed(confirmed) ? null : confirmed.replace(/^citation not yet confirmed: /, "");
