import { renderDeviationRecord } from "../../pdf/deviation-record-pdf.tsx";
import { getDeviation } from "./deviation-queries.ts";
import { statusOfLot } from "../lots/lot-queries.ts";
import type { SessionMembership, SessionUser } from "../session-service.ts";

export async function deviationPdf(orgId: number, id: number, user: SessionUser, membership: SessionMembership) {
  const d = await getDeviation(orgId, id, user, membership);
  const lotStatus = await statusOfLot(d.lotId);
  return {
    filename: `deviation-${d.id}-${d.lotCode.replace(/[^A-Za-z0-9._-]+/g, "-")}.pdf`,
    pdf: await renderDeviationRecord(d, lotStatus),
  };
}
