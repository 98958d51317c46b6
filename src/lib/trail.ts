/** Requests on the trail that several pages show: one record's history, and checking the hash chain. */
import { queryOptions } from "@tanstack/react-query";
import { api } from "./api-client.ts";
import type { ChainVerification, TrailEntryView } from "../../shared/trail/views.ts";
import type { HistoryEntityType } from "../../shared/trail/history.ts";

export const historyKeys = {
  all: (orgId: number) => ["orgs", orgId, "history"] as const,
  of: (orgId: number, type: HistoryEntityType, id: number) => [...historyKeys.all(orgId), type, id] as const,
};

export const historyQuery = (orgId: number, type: HistoryEntityType, id: number) =>
  queryOptions({
    queryKey: historyKeys.of(orgId, type, id),
    queryFn: () => api<TrailEntryView[]>(`/api/orgs/${orgId}/history/${type}/${id}`),
  });

export const verifyChain = (orgId: number) => api<ChainVerification>(`/api/orgs/${orgId}/trail/verify`);
