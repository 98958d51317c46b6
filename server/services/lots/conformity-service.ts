/** Gathers what a lot's certificate of conformity states, and the one-line statement it opens with. */
import { getLot } from "./lot-queries.ts";
import { worstOf } from "./evaluate-analysis.ts";
import { conflict } from "../../http/problem.ts";
import { renderConformityCertificate, type ConformityData } from "../../pdf/conformity-pdf.tsx";
import type { Outcome } from "../../../shared/engine/index.ts";

function statementFor(worst: Outcome, discrepant: boolean): string {
  const tail = discrepant ? " The independent audit disagrees with the declared results; see the deviation opened for it." : "";
  switch (worst) {
    case "pass":
    case "not required":
      return `Conforms: every required result meets its governing limit under the agreed decision rule.${tail}`;
    case "conditional pass":
      return `Conforms, conditionally: at least one result lies within its uncertainty of a limit (ILAC-G8 conditional pass).${tail}`;
    case "conditional fail":
    case "fail":
      return `Does not conform: at least one result falls outside its governing limit.${tail}`;
    default:
      return `No statement of conformity: required results are missing or inconclusive.${tail}`;
  }
}

export async function conformityCertificate(orgId: number, lotId: number, role: string): Promise<{ filename: string; pdf: Buffer }> {
  const lot = await getLot(orgId, lotId, role);
  const declared = [...lot.analyses].reverse().find((a) => a.auditOrderId === null && a.evaluation) ?? null;
  const latestAudit = lot.audits[0] ?? null;
  const audit = latestAudit ? { ...latestAudit, analysis: lot.analyses.find((a) => a.id === latestAudit.analysisId) ?? null } : null;
  if (!declared && !audit?.analysis) throw conflict("This lot has no evaluated results yet; a certificate needs at least one analysis.");
  const outcomes = [...(declared?.evaluation?.verdicts ?? []), ...(audit?.analysis?.evaluation?.verdicts ?? [])].map((v) => v.outcome);
  const discrepant = audit?.comparisons.some((c) => c.outcome === "discrepant") ?? false;
  const today = new Date().toISOString().slice(0, 10).replaceAll("-", "");
  const data: ConformityData = { number: `CC-${lot.id}-${today}`, lot, declared, audit, statement: statementFor(worstOf(outcomes), discrepant) };
  return { filename: `conformity-${lot.lotCode.replace(/[^A-Za-z0-9._-]+/g, "-")}.pdf`, pdf: await renderConformityCertificate(data) };
}
