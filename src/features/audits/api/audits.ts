import { queryOptions, useMutation } from "@tanstack/react-query";
import { useRefreshOrganisation } from "../../../lib/refresh.ts";
import { PAGE_SIZE_MAX, type Page } from "../../../../shared/paging.ts";
import { pagedQuery, queryString } from "../../../lib/paged.ts";
import { api } from "../../../lib/api-client.ts";
import type { LabResultsInput, NewAuditOrder, PriceListInput } from "../../../../shared/audits/schemas.ts";
import type { AuditOrderDetail, AuditOrderSummary, FinanceDashboard, LaboratoryOffer } from "../../../../shared/audits/views.ts";
import type { LotSummary } from "../../../../shared/lots/views.ts";

const base = (orgId: number) => `/api/orgs/${orgId}`;

export const auditKeys = {
  all: (orgId: number) => ["orgs", orgId, "audits"] as const,
  list: (orgId: number, f: Record<string, string | undefined>) => [...auditKeys.all(orgId), "list", f] as const,
  detail: (orgId: number, id: number) => [...auditKeys.all(orgId), "detail", id] as const,
  dashboard: (orgId: number, f: Record<string, string | undefined>) => [...auditKeys.all(orgId), "dashboard", f] as const,
  laboratories: (orgId: number) => [...auditKeys.all(orgId), "laboratories"] as const,
  priceList: (orgId: number) => [...auditKeys.all(orgId), "price-list"] as const,
  lotsOf: (orgId: number, contractId: number) => [...auditKeys.all(orgId), "lots-of", contractId] as const,
};

export const ordersQuery = (orgId: number, f: Record<string, string | undefined>) =>
  pagedQuery<AuditOrderSummary>(auditKeys.list(orgId, f), `${base(orgId)}/audit-orders`, f);
export const orderQuery = (orgId: number, id: number) =>
  queryOptions({ queryKey: auditKeys.detail(orgId, id), queryFn: () => api<AuditOrderDetail>(`${base(orgId)}/audit-orders/${id}`) });
export const dashboardQuery = (orgId: number, f: Record<string, string | undefined>) =>
  queryOptions({
    queryKey: auditKeys.dashboard(orgId, f),
    queryFn: () => api<FinanceDashboard>(`${base(orgId)}/audit-dashboard${queryString(f)}`),
  });
export const laboratoriesQuery = (orgId: number) =>
  queryOptions({ queryKey: auditKeys.laboratories(orgId), queryFn: () => api<LaboratoryOffer[]>(`${base(orgId)}/laboratories`) });
export const priceListQuery = (orgId: number) =>
  queryOptions({
    queryKey: auditKeys.priceList(orgId),
    queryFn: () => api<{ currency: string; items: PriceListInput["items"] }>(`${base(orgId)}/price-list`),
  });

/** The contract's lots an order can cover: the newest page of them, as one order covers at most a few. */
export const orderableLotsQuery = (orgId: number, contractId: number) =>
  queryOptions({
    queryKey: auditKeys.lotsOf(orgId, contractId),
    queryFn: async () => (await api<Page<LotSummary>>(`${base(orgId)}/lots?contract=${contractId}&limit=${PAGE_SIZE_MAX}`)).items,
  });

export const invoiceUrl = (orgId: number, id: number) => `${base(orgId)}/audit-orders/${id}/invoice.pdf`;

/** An order's payment or results change its lots, deviations and notifications too. */
const useInvalidate = (orgId: number) => useRefreshOrganisation(orgId);

export function useCreateOrder(orgId: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({
    mutationFn: (o: NewAuditOrder) =>
      api<{ id: number; reference: string; amountCents: number }>(`${base(orgId)}/audit-orders`, { method: "POST", body: o }),
    onSuccess: invalidate,
  });
}
export function useCheckout(orgId: number, id: number) {
  return useMutation({ mutationFn: () => api<{ url: string }>(`${base(orgId)}/audit-orders/${id}/checkout`, { method: "POST" }) });
}
export function useRefund(orgId: number, id: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({
    mutationFn: (reason: string) =>
      api<{ refundId: string; amountCents: number }>(`${base(orgId)}/audit-orders/${id}/refund`, { method: "POST", body: { reason } }),
    onSuccess: invalidate,
  });
}
export function useSubmitLabResults(orgId: number, id: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({
    mutationFn: (input: LabResultsInput) =>
      api<{
        discrepancies: { lotId: number; parameters: string[] }[];
        failing: { lotCode: string; parameters: string[] }[];
        deviationIds: number[];
      }>(`${base(orgId)}/audit-orders/${id}/results`, { method: "POST", body: input }),
    onSuccess: invalidate,
  });
}
export function useSavePriceList(orgId: number) {
  const invalidate = useInvalidate(orgId);
  return useMutation({
    mutationFn: (input: PriceListInput) =>
      api<{ currency: string; items: PriceListInput["items"] }>(`${base(orgId)}/price-list`, { method: "PUT", body: input }),
    onSuccess: invalidate,
  });
}
