/** Requests of the spec-sheet feature, with their query keys kept next to them. */
import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import { pagedQuery } from "../../../lib/paged.ts";
import type { CommentInput, NewContractInput, NewVersionInput, SpecDraftInput } from "../../../../shared/specs/schemas.ts";
import type { PastResults, SpecDiff, SpecListItem } from "../../../../shared/specs/views.ts";
import { contractKeys } from "../../../lib/contracts.ts";

export interface SpecFilters {
  wine?: number;
  producer?: number;
  market?: string;
  status?: string;
  q?: string;
}

const base = (orgId: number) => `/api/orgs/${orgId}`;

export const specKeys = {
  all: (orgId: number) => ["orgs", orgId, "specs"] as const,
  list: (orgId: number, f: SpecFilters) => [...specKeys.all(orgId), "list", f] as const,
  diff: (orgId: number, id: number, against: number) => [...specKeys.all(orgId), "diff", id, against] as const,
  results: (orgId: number, contractId: number, lots: number, parameters: string[]) =>
    [...specKeys.all(orgId), "results", contractId, lots, parameters] as const,
};

export const specListQuery = (orgId: number, f: SpecFilters) =>
  pagedQuery<SpecListItem>(specKeys.list(orgId, f), `${base(orgId)}/specs`, { ...f });

export const diffQuery = (orgId: number, id: number, against: number) =>
  queryOptions({
    queryKey: specKeys.diff(orgId, id, against),
    queryFn: () => api<SpecDiff>(`${base(orgId)}/specs/${id}/diff?against=${against}`),
  });
/** The past results of the contract's last `lots` lots, for the parameters a backtest compares. */
export const pastResultsQuery = (orgId: number, contractId: number, lots: number, parameters: string[]) =>
  queryOptions({
    queryKey: specKeys.results(orgId, contractId, lots, parameters),
    queryFn: () =>
      api<PastResults>(
        `${base(orgId)}/contracts/${contractId}/results?lots=${lots}&parameters=${encodeURIComponent(parameters.join(","))}`,
      ),
  });

export const specPdfUrl = (orgId: number, id: number) => `${base(orgId)}/specs/${id}/pdf`;

/** Refreshes everything a spec change can alter: the feature's own queries and the shared contract and version reads. */
export function useInvalidateSpecs(orgId: number) {
  const qc = useQueryClient();
  return () =>
    Promise.all([qc.invalidateQueries({ queryKey: specKeys.all(orgId) }), qc.invalidateQueries({ queryKey: contractKeys.all(orgId) })]);
}

export function useCreateVersion(orgId: number, contractId: number) {
  const invalidate = useInvalidateSpecs(orgId);
  return useMutation({
    mutationFn: (input: NewVersionInput) =>
      api<{ id: number }>(`${base(orgId)}/contracts/${contractId}/specs`, { method: "POST", body: input }),
    onSuccess: invalidate,
  });
}

export function useSaveDraft(orgId: number, id: number) {
  return useMutation({
    mutationFn: (input: SpecDraftInput) =>
      api<{ lockVersion: number; updatedAt: string }>(`${base(orgId)}/specs/${id}`, { method: "PUT", body: input }),
  });
}

/** Lifecycle actions that take no body but the optional reason. */
export function useSpecAction(orgId: number, id: number, action: "send" | "withdraw" | "agree" | "request-changes") {
  const invalidate = useInvalidateSpecs(orgId);
  return useMutation({
    mutationFn: (body?: { reason: string }) => api<void>(`${base(orgId)}/specs/${id}/${action}`, { method: "POST", body }),
    onSuccess: invalidate,
  });
}

export function useAddComment(orgId: number, id: number) {
  const invalidate = useInvalidateSpecs(orgId);
  return useMutation({
    mutationFn: (input: CommentInput) => api<{ id: number }>(`${base(orgId)}/specs/${id}/comments`, { method: "POST", body: input }),
    onSuccess: invalidate,
  });
}

export const producersQuery = (orgId: number) =>
  queryOptions({
    queryKey: [...specKeys.all(orgId), "producers"],
    queryFn: () => api<{ id: number; name: string; country: string }[]>(`${base(orgId)}/producers`),
  });

export function useCreateContract(orgId: number) {
  const invalidate = useInvalidateSpecs(orgId);
  return useMutation({
    mutationFn: (input: NewContractInput) => api<{ id: number }>(`${base(orgId)}/contracts`, { method: "POST", body: input }),
    onSuccess: invalidate,
  });
}
