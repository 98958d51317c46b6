/** Addresses of the files both sides download: a lot's conformity document and an analysis's certificate. */
import { uploadFile } from "./upload.ts";

export const conformityUrl = (orgId: number, lotId: number) => `/api/orgs/${orgId}/lots/${lotId}/conformity.pdf`;
export const certificateUrl = (orgId: number, id: number) => `/api/orgs/${orgId}/certificates/${id}`;
export const uploadCertificate = (orgId: number, analysisId: number, file: File) =>
  uploadFile<{ id: number; sha256: string }>(`/api/orgs/${orgId}/analyses/${analysisId}/certificates`, file);
