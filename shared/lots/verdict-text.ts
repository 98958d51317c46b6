/** A stored verdict as short text in its spec row's unit: the result with U (k = 2) and the governing limits, rounded to the parameter's precision. */
import { convert, displayValue, unconfirmedReason, unitLabel } from "../engine/index.ts";
import type { StoredBound, StoredVerdict } from "./views.ts";

function boundText(parameter: string, b: StoredBound, factor: number, display: string): string {
  const source = b.source === "buyer" ? "buyer" : `law${b.market ? `, ${b.market}` : ""}`;
  return `${displayValue(parameter, b.value * factor, display)} ${unitLabel(display)} (${source})`;
}

export function verdictText(v: StoredVerdict): { result: string; limits: string; uncertainty: string } {
  const display = v.displayUnit;
  const factor = convert(1, v.unit, display);
  const unit = unitLabel(display);
  const shown = (x: number) => displayValue(v.parameter, x, display);
  const limits =
    [
      v.lower && `min ${boundText(v.parameter, v.lower, factor, display)}`,
      v.upper && `max ${boundText(v.parameter, v.upper, factor, display)}`,
    ]
      .filter(Boolean)
      .join("; ") || "—";
  const u = v.uncertainty && v.uncertainty.source !== "none" ? v.uncertainty : null;
  const value = v.value === null ? v.resultText : shown(v.value * factor);
  return {
    result: value === null ? "not reported" : `${value}${u ? ` ± ${shown(2 * u.u * factor)}` : ""} ${unit}`,
    limits,
    uncertainty: u
      ? `U = ${shown(2 * u.u * factor)} ${unit}, k = 2 (${u.source === "laboratory" ? "laboratory" : "Cellarpact default"})`
      : "none stated",
  };
}

/** The legal texts the governing limits of these verdicts come from, once each, with whether each citation was confirmed in the published text. */
export function governingCitations(verdicts: readonly StoredVerdict[]): { market: string; text: string; unconfirmed: string | null }[] {
  const seen = new Map<string, { market: string; text: string; unconfirmed: string | null }>();
  for (const v of verdicts) {
    for (const b of [v.lower, v.upper]) {
      if (!b || b.source !== "law" || !b.citation) continue;
      const text = `${b.citation.document}, ${b.citation.article} (${b.citation.edition})`;
      if (seen.has(text)) continue;
      const confirmed = v.legalLimits.find(
        (l) => l.citation.document === b.citation!.document && l.citation.article === b.citation!.article,
      )?.confirmed;
      seen.set(text, {
        market: b.market ?? "",
        text,
        unconfirmed: unconfirmedReason(confirmed),
      });
    }
  }
  return [...seen.values()];
}
