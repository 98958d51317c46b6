/**
 * Laboratory certificates: type decided by the file's content (PDF, PNG, JPEG), stored under a random
 * name outside the web root, its SHA-256 on the trail, downloadable by both parties. The producer
 * documents its own analyses; an independent audit's report is attached by the laboratory that wrote it.
 */
import { Analysis } from "../../models/analysis.ts";
import { Certificate } from "../../models/certificate.ts";
import { inTransaction } from "../../db/database.ts";
import { recordTrail } from "../trail/trail-service.ts";
import { forbidden, notFound } from "../../errors.ts";
import { discardFile, readStoredFile, saveCheckedFile } from "../../integrations/storage/stored-files.ts";
import { lotFor } from "./lot-access.ts";
import { orderFor } from "../audits/order-access.ts";
import type { SessionUser } from "../session-service.ts";

/** The laboratory of the audit that produced this analysis, if the caller is it. */
async function isAuditLaboratory(orgId: number, analysis: Analysis): Promise<boolean> {
  if (!analysis.auditOrderId) return false;
  return (await orderFor(orgId, analysis.auditOrderId).catch(() => null))?.side === "laboratory";
}

async function mayAttach(orgId: number, analysis: Analysis): Promise<void> {
  if (await isAuditLaboratory(orgId, analysis)) return;
  const { side } = await lotFor(orgId, analysis.lotId).catch(() => {
    throw notFound("The analysis");
  });
  if (side !== "producer") throw notFound("The analysis");
  if (analysis.auditOrderId) throw forbidden("This analysis came from an independent audit; its report belongs to the laboratory.");
}

export async function storeCertificate(
  orgId: number,
  analysisId: number,
  user: SessionUser,
  file: { buffer: Buffer; originalname: string },
) {
  const analysis = await Analysis.findByPk(analysisId);
  if (!analysis) throw notFound("The analysis");
  await mayAttach(orgId, analysis);
  const saved = await saveCheckedFile(file);
  try {
    return await inTransaction(async (t) => {
      const cert = await Certificate.create({ analysisId, ...saved, uploadedBy: user.id }, { transaction: t });
      await recordTrail(t, {
        actorUserId: user.id,
        organisationId: orgId,
        action: "certificate.uploaded",
        entityType: "certificate",
        entityId: cert.id,
        details: { analysisId, sha256: saved.sha256, bytes: saved.sizeBytes, mime: saved.mime },
      });
      return { id: cert.id, sha256: saved.sha256, mime: saved.mime };
    });
  } catch (err) {
    await discardFile(saved.storedName);
    throw err;
  }
}

export async function readCertificate(orgId: number, certificateId: number) {
  const cert = await Certificate.findByPk(certificateId);
  if (!cert) throw notFound("The certificate");
  const analysis = (await Analysis.findByPk(cert.analysisId))!;
  if (!(await isAuditLaboratory(orgId, analysis))) {
    await lotFor(orgId, analysis.lotId).catch(() => {
      throw notFound("The certificate");
    });
  }
  return { body: await readStoredFile(cert.storedName), mime: cert.mime, filename: cert.originalName };
}
