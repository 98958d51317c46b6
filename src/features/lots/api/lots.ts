import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import { pagedQuery } from "../../../lib/paged.ts";
import type { AnalysisSubmission, ImportBatch, LotInput } from "../../../../shared/lots/schemas.ts";
import type { ImportResult, LotDetail, LotSummary, ReadinessRow, SubmissionResult, TrendData } from "../../../../shared/lots/views.ts";

const base = (orgId: number) => `/api/orgs/${orgId}`;

export const lotKeys = {
  all: (orgId: number) => ["orgs", orgId, "lots"] as const,
  list: (orgId: number, f: { contract?: number; q?: string }) => [...lotKeys.all(orgId), "list", f] as const,
  detail: (orgId: number, id: number) => [...lotKeys.all(orgId), "detail", id] as const,
  readiness: (orgId: number, horizon: number) => [...lotKeys.all(orgId), "readiness", horizon] as const,
  trend: (orgId: number, contractId: number, parameter: string, vintages: number) =>
    [...lotKeys.all(orgId), "trend", contractId, parameter, vintages] as const,
};

export const lotsQuery = (orgId: number, f: { contract?: number; q?: string }) =>
  pagedQuery<LotSummary>(lotKeys.list(orgId, f), `${base(orgId)}/lots`, f);
export const lotQuery = (orgId: number, id: number) =>
  queryOptions({ queryKey: lotKeys.detail(orgId, id), queryFn: () => api<LotDetail>(`${base(orgId)}/lots/${id}`) });
export const readinessQuery = (orgId: number, horizon: number) =>
  pagedQuery<ReadinessRow>(lotKeys.readiness(orgId, horizon), `${base(orgId)}/readiness`, { horizon });
export const trendQuery = (orgId: number, contractId: number, parameter: string, vintages: number) =>
  queryOptions({
    queryKey: lotKeys.trend(orgId, contractId, parameter, vintages),
    queryFn: () => api<TrendData>(`${base(orgId)}/contracts/${contractId}/trend?parameter=${parameter}&vintages=${vintages}`),
  });

function useInvalidateLots(orgId: number) {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: lotKeys.all(orgId) });
}

export function useRegisterLot(orgId: number) {
  const invalidate = useInvalidateLots(orgId);
  return useMutation({
    mutationFn: (input: LotInput) => api<{ id: number }>(`${base(orgId)}/lots`, { method: "POST", body: input }),
    onSuccess: invalidate,
  });
}

export function useSubmitAnalysis(orgId: number, lotId: number) {
  const invalidate = useInvalidateLots(orgId);
  return useMutation({
    mutationFn: (input: AnalysisSubmission) =>
      api<SubmissionResult>(`${base(orgId)}/lots/${lotId}/analyses`, { method: "POST", body: input }),
    onSuccess: invalidate,
  });
}

export const importBatch = (orgId: number, contractId: number, batch: ImportBatch) =>
  api<ImportResult>(`${base(orgId)}/contracts/${contractId}/imports`, { method: "POST", body: batch });

/** Judge an analysis again against the version now in force; recorded as a new analysis. */
export function useRejudge(orgId: number, lotId: number) {
  const invalidate = useInvalidateLots(orgId);
  return useMutation({
    mutationFn: (analysisId: number) =>
      api<SubmissionResult>(`${base(orgId)}/lots/${lotId}/analyses/${analysisId}/rejudge`, { method: "POST" }),
    onSuccess: invalidate,
  });
}
