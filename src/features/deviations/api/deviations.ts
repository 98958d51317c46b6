import { queryOptions, useMutation } from "@tanstack/react-query";
import { useRefreshOrganisation } from "../../../lib/refresh.ts";
import { api } from "../../../lib/api-client.ts";
import { pagedQuery } from "../../../lib/paged.ts";
import type { DecisionInput, MessageInput } from "../../../../shared/deviations/schemas.ts";
import type { DeviationDetail, DeviationSummaryView } from "../../../../shared/deviations/views.ts";

const base = (orgId: number) => `/api/orgs/${orgId}`;

export const deviationKeys = {
  all: (orgId: number) => ["orgs", orgId, "deviations"] as const,
  list: (orgId: number, f: Record<string, string | undefined>) => [...deviationKeys.all(orgId), "list", f] as const,
  detail: (orgId: number, id: number) => [...deviationKeys.all(orgId), "detail", id] as const,
};

export const deviationsQuery = (orgId: number, f: Record<string, string | undefined>) =>
  pagedQuery<DeviationSummaryView>(deviationKeys.list(orgId, f), `${base(orgId)}/deviations`, f);
export const deviationQuery = (orgId: number, id: number) =>
  queryOptions({ queryKey: deviationKeys.detail(orgId, id), queryFn: () => api<DeviationDetail>(`${base(orgId)}/deviations/${id}`) });
export const deviationPdfUrl = (orgId: number, id: number) => `${base(orgId)}/deviations/${id}/pdf`;
export const attachmentUrl = (orgId: number, id: number) => `${base(orgId)}/deviation-attachments/${id}`;

/** A message or decision changes the deviation, its lot's page, the trail and the parties' notifications. */
const useInvalidate = (orgId: number) => useRefreshOrganisation(orgId);

export function usePostMessage(orgId: number, id: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({
    mutationFn: (m: MessageInput) => api<{ id: number }>(`${base(orgId)}/deviations/${id}/messages`, { method: "POST", body: m }),
    onSuccess: invalidate,
  });
}
export function useEditMessage(orgId: number, id: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({
    mutationFn: (p: { messageId: number; body: string }) =>
      api<void>(`${base(orgId)}/deviations/${id}/messages/${p.messageId}`, { method: "PATCH", body: { body: p.body } }),
    onSuccess: invalidate,
  });
}
export function useDecide(orgId: number, id: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({
    mutationFn: (d: DecisionInput) =>
      api<{ specVersionId: number | null }>(`${base(orgId)}/deviations/${id}/decision`, { method: "POST", body: d }),
    onSuccess: invalidate,
  });
}
export function useCloseDeviation(orgId: number, id: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({ mutationFn: () => api<void>(`${base(orgId)}/deviations/${id}/close`, { method: "POST" }), onSuccess: invalidate });
}
