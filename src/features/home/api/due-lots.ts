import { queryOptions } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import type { ReadinessRow } from "../../../../shared/lots/views.ts";
import type { Page } from "../../../../shared/paging.ts";
import { PAGE_SIZE_MAX } from "../../../../shared/paging.ts";

/** The overview's own request: the soonest lots due, each with its one status (one page; `total` counts them all). */
export const dueLotsQuery = (orgId: number) =>
  queryOptions({
    queryKey: ["orgs", orgId, "overview", "due-lots"] as const,
    queryFn: () => api<Page<ReadinessRow>>(`/api/orgs/${orgId}/readiness?limit=${PAGE_SIZE_MAX}`),
  });
