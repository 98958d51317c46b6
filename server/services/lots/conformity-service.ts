/**
 * The lot's document: a certificate of conformity when the lot's status allows one (it conforms,
 * or was accepted under concession, which it then names with its conditions), otherwise an
 * analysis statement that says plainly why the lot does not conform. The status is the one the
 * screens show, from `lotStatus`.
 */
import { getLot } from "./lot-queries.ts";
import { conflict } from "../../errors.ts";
import { renderLotDocument, type LotDocumentData } from "../../pdf/conformity-pdf.tsx";
import { CERTIFIABLE } from "../../../shared/lots/lot-status.ts";
import { ROLE_LABELS, type Role } from "../../../shared/auth/roles.ts";
import type { SessionUser } from "../session-service.ts";

export async function lotDocument(
  orgId: number,
  lotId: number,
  user: SessionUser,
  role: Role,
): Promise<{ filename: string; pdf: Buffer; kind: LotDocumentData["kind"] }> {
  const lot = await getLot(orgId, lotId, role);
  if (lot.status.code === "awaiting_results")
    throw conflict(`Lot ${lot.lotCode} has no results judged against an agreed specification yet, so there is nothing to declare.`);
  const counted = lot.analyses.filter((a) => lot.status.analysisIds.includes(a.id));
  const latestAudit = lot.audits[0] ?? null;
  const audit = latestAudit ? { ...latestAudit, analysis: lot.analyses.find((a) => a.id === latestAudit.analysisId) ?? null } : null;
  const kind = CERTIFIABLE.includes(lot.status.code) ? "certificate" : "statement";
  const issuedAt = new Date();
  const organisation = user.memberships.find((m) => m.organisationId === orgId)?.organisationName ?? "";
  const data: LotDocumentData = {
    kind,
    number: `${kind === "certificate" ? "CC" : "AS"}-${lot.id}-${issuedAt.toISOString().slice(0, 10).replaceAll("-", "")}`,
    lot,
    declared: counted.filter((a) => a.auditOrderId === null),
    audit,
    issuedBy: { name: user.name, role: ROLE_LABELS[role], organisation },
    issuedAt,
  };
  const stem = kind === "certificate" ? "conformity" : "analysis-statement";
  return { filename: `${stem}-${lot.lotCode.replace(/[^A-Za-z0-9._-]+/g, "-")}.pdf`, pdf: await renderLotDocument(data), kind };
}
