import { renderSpecSheetPdf } from "../../pdf/spec-sheet-pdf.tsx";
import { getVersion } from "./spec-queries.ts";
import type { Role } from "../../../shared/auth/roles.ts";

export async function specSheetPdf(orgId: number, specId: number, role: Role): Promise<{ filename: string; pdf: Buffer }> {
  const v = await getVersion(orgId, specId, role);
  const pdf = await renderSpecSheetPdf({ ...v, generatedAt: new Date() });
  const safe = `${v.contract.reference}-v${v.number}-${v.contract.wine.name}`.replace(/[^A-Za-z0-9._-]+/g, "-");
  return { filename: `${safe}.pdf`, pdf };
}
