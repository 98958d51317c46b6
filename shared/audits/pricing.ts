/** The price of an audit from a laboratory's price list: each parameter's price, once per lot. */
import { findParameter } from "../engine/index.ts";

export interface PriceListItem {
  parameter: string;
  priceCents: number;
}

export interface QuoteLine {
  parameter: string;
  name: string;
  unitCents: number;
  lots: number;
  totalCents: number;
}

export interface Quote {
  lines: QuoteLine[];
  totalCents: number;
  /** Parameters the laboratory does not offer; an order cannot include them. */
  unpriced: string[];
}

export function quoteAudit(prices: PriceListItem[], lotCount: number, parameters: string[]): Quote {
  const byParameter = new Map(prices.map((p) => [p.parameter, p.priceCents]));
  const lines: QuoteLine[] = [];
  const unpriced: string[] = [];
  for (const parameter of parameters) {
    const unitCents = byParameter.get(parameter);
    if (unitCents === undefined) unpriced.push(parameter);
    else
      lines.push({
        parameter,
        name: findParameter(parameter)?.name ?? parameter,
        unitCents,
        lots: lotCount,
        totalCents: unitCents * lotCount,
      });
  }
  return { lines, totalCents: lines.reduce((s, l) => s + l.totalCents, 0), unpriced };
}
