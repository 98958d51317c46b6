import { queryOptions } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import type { ReadinessRow } from "../../../../shared/lots/views.ts";

/** The overview's own request: the lots due soon, each with its one status. */
export const dueLotsQuery = (orgId: number) =>
  queryOptions({
    queryKey: ["orgs", orgId, "overview", "due-lots"] as const,
    queryFn: () => api<ReadinessRow[]>(`/api/orgs/${orgId}/readiness`),
  });
