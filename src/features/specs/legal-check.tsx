/** The live check beside a row: the destination markets' limits with citations, which bound governs, and warnings. */
import {
  buildRequirement,
  unconfirmedReason,
  RequirementError,
  UNITS,
  type BuyerRequirement,
  type GoverningRequirement,
  type MarketId,
  type WineProfile,
} from "../../../shared/engine/index.ts";

const num = (x: number) => String(Number(x.toPrecision(5)));

export function checkRow(row: BuyerRequirement, markets: MarketId[], profile: WineProfile): GoverningRequirement | { error: string } {
  try {
    return buildRequirement(row, markets, profile);
  } catch (err) {
    return { error: err instanceof RequirementError ? err.message : "This row cannot be checked yet." };
  }
}

export function LegalCheck({ row, markets, profile }: { row: BuyerRequirement; markets: MarketId[]; profile: WineProfile }) {
  const r = checkRow(row, markets, profile);
  if ("error" in r) return <p className="text-xs text-alarm-700">{r.error}</p>;
  const unit = UNITS[r.unit].label;
  const governing = [r.upper, r.lower].filter((b) => b?.source.kind === "law");
  return (
    <div className="flex flex-col gap-1 text-xs">
      {r.legalLimits.length === 0 && r.undetermined.length === 0 && <p className="text-ink-500">No legal limit in these markets.</p>}
      {r.legalLimits.map((l) => (
        <p
          key={l.ruleId}
          className={
            governing.some((g) => g?.source.kind === "law" && g.source.limit.ruleId === l.ruleId)
              ? "font-semibold text-ink-900"
              : "text-ink-700"
          }
        >
          {l.market}: {l.side === "max" ? "at most" : "at least"} {num(l.statedValue)} {l.statedUnit}
          {l.statedUnit !== unit && ` (${num(l.value)} ${unit})`}
          <span className="block font-normal text-ink-500">
            {l.citation.document}, {l.citation.article}
          </span>
          {unconfirmedReason(l.confirmed) && (
            <span className="block font-normal text-ochre-700">Citation not yet confirmed: {unconfirmedReason(l.confirmed)}</span>
          )}
        </p>
      ))}
      {governing.map((g) =>
        g?.source.kind === "law" ? (
          <p key={g.source.limit.ruleId} className="font-semibold text-ochre-700">
            The law governs this side: {g.source.limit.marketName}.
          </p>
        ) : null,
      )}
      {r.issues
        .filter((i) => i.severity === "warning")
        .map((i) => (
          <p key={i.message} className="text-ochre-700" role="status">
            {i.message}
          </p>
        ))}
    </div>
  );
}
