/** Contracts and spec versions as several features read them: the specs pages, the lots pages and audit orders. */
import { queryOptions } from "@tanstack/react-query";
import { api } from "./api-client.ts";
import type { ContractDetail, ContractWithVersions, SpecVersionDetail } from "../../shared/specs/views.ts";

const base = (orgId: number) => `/api/orgs/${orgId}`;

export const contractKeys = {
  all: (orgId: number) => ["orgs", orgId, "contracts"] as const,
  list: (orgId: number) => [...contractKeys.all(orgId), "list"] as const,
  detail: (orgId: number, id: number) => [...contractKeys.all(orgId), "detail", id] as const,
  version: (orgId: number, id: number) => [...contractKeys.all(orgId), "version", id] as const,
};

export const contractsQuery = (orgId: number) =>
  queryOptions({ queryKey: contractKeys.list(orgId), queryFn: () => api<ContractWithVersions[]>(`${base(orgId)}/contracts`) });
export const contractQuery = (orgId: number, id: number) =>
  queryOptions({ queryKey: contractKeys.detail(orgId, id), queryFn: () => api<ContractDetail>(`${base(orgId)}/contracts/${id}`) });
export const specQuery = (orgId: number, id: number) =>
  queryOptions({ queryKey: contractKeys.version(orgId, id), queryFn: () => api<SpecVersionDetail>(`${base(orgId)}/specs/${id}`) });
