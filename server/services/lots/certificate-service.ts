/**
 * Laboratory certificates: type decided by the file's content (PDF, PNG, JPEG), stored under a random
 * name outside the web root, its SHA-256 in the audit log, downloadable by both parties.
 */
import { fileTypeFromBuffer } from "file-type";
import { mkdir, readFile, writeFile, unlink } from "node:fs/promises";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { Analysis } from "../../models/lot.ts";
import { Certificate } from "../../models/evaluation.ts";
import { inTransaction } from "../../db/database.ts";
import { recordAudit } from "../audit-service.ts";
import { sha256 } from "../../lib/crypto.ts";
import { HttpError, notFound } from "../../http/problem.ts";
import { serviceSettings } from "../settings.ts";
import { lotFor } from "./lot-access.ts";
import type { SessionUser } from "../session-service.ts";

export const CERTIFICATE_TYPES: Record<string, string> = { "application/pdf": "pdf", "image/png": "png", "image/jpeg": "jpg" };

export async function storeCertificate(orgId: number, analysisId: number, user: SessionUser, file: { buffer: Buffer; originalname: string }) {
  const analysis = await Analysis.findByPk(analysisId);
  if (!analysis) throw notFound("The analysis");
  const { side } = await lotFor(orgId, analysis.lotId).catch(() => {
    throw notFound("The analysis");
  });
  if (side !== "producer") throw notFound("The analysis");
  const detected = await fileTypeFromBuffer(file.buffer);
  if (!detected || !CERTIFICATE_TYPES[detected.mime]) {
    throw new HttpError(415, "Unsupported media type", `The file's content is ${detected ? detected.mime : "not a known type"}; upload the certificate as PDF, PNG or JPEG.`);
  }
  const dir = serviceSettings().certificateDir;
  await mkdir(dir, { recursive: true });
  const storedName = `${randomUUID()}.${CERTIFICATE_TYPES[detected.mime]}`;
  const digest = sha256(file.buffer);
  await writeFile(path.join(dir, storedName), file.buffer, { flag: "wx" });
  try {
    return await inTransaction(async (t) => {
      const cert = await Certificate.create(
        { analysisId, originalName: path.basename(file.originalname).slice(0, 200), storedName, mime: detected.mime, sizeBytes: file.buffer.length, sha256: digest, uploadedBy: user.id },
        { transaction: t },
      );
      await recordAudit(t, { actorUserId: user.id, organisationId: orgId, action: "certificate.uploaded", entityType: "certificate", entityId: cert.id, details: { analysisId, sha256: digest, bytes: file.buffer.length, mime: detected.mime } });
      return { id: cert.id, sha256: digest, mime: detected.mime };
    });
  } catch (err) {
    // The database said no: leave no orphan file behind.
    await unlink(path.join(dir, storedName)).catch(() => undefined);
    throw err;
  }
}

export async function readCertificate(orgId: number, certificateId: number) {
  const cert = await Certificate.findByPk(certificateId);
  if (!cert) throw notFound("The certificate");
  const analysis = await Analysis.findByPk(cert.analysisId);
  await lotFor(orgId, analysis!.lotId).catch(() => {
    throw notFound("The certificate");
  });
  const body = await readFile(path.join(serviceSettings().certificateDir, cert.storedName));
  return { body, mime: cert.mime, filename: cert.originalName };
}
