import { z } from "zod";
import type { RouteRegistry } from "../http/route-registry.ts";
import { idempotentAnswer } from "../http/idempotent-answer.ts";
import { allowed } from "../http/access.ts";
import { idParam } from "../../shared/ids.ts";
import { auditListQuerySchema, labResultsSchema, newAuditOrderSchema, priceListSchema } from "../../shared/audits/schemas.ts";
import * as orders from "../services/audits/order-service.ts";
import { listLaboratories, priceList, setPriceList } from "../services/audits/price-list-service.ts";
import { submitLabResults } from "../services/audits/lab-results-service.ts";
import { financeDashboard } from "../services/audits/finance-dashboard.ts";
import { invoicePdf } from "../services/audits/invoice-service.ts";

const orgParams = z.object({ orgId: idParam });
const orderParams = orgParams.extend({ orderId: idParam });
const FINANCE = allowed("audits.order");
const BUYERS = allowed("audits.browse");
const READERS = allowed("audits.read");

export function registerComplianceAuditRoutes(r: RouteRegistry): void {
  const routes = r.section("audits");
  routes.get(
    "/api/orgs/:orgId/laboratories",
    { summary: "Laboratories and their price lists, to order an audit from", access: BUYERS, params: orgParams },
    () => listLaboratories(),
  );

  routes.get(
    "/api/orgs/:orgId/price-list",
    { summary: "Your laboratory's price list", access: allowed("prices.read"), params: orgParams },
    ({ params }) => priceList(params.orgId),
  );
  routes.put(
    "/api/orgs/:orgId/price-list",
    {
      summary: "Replace your laboratory's price list (prices in integer cents)",
      access: allowed("prices.manage"),
      params: orgParams,
      body: priceListSchema,
    },
    ({ params, user, body }) => setPriceList(params.orgId, user, body),
  );

  routes.post(
    "/api/orgs/:orgId/audit-orders",
    {
      summary: "Order an independent audit of lots (priced from the laboratory's list; idempotent by key)",
      access: FINANCE,
      params: orgParams,
      body: newAuditOrderSchema,
      status: 201,
      errors: { 409: "idempotency key reused with another body" },
    },
    async ({ params, user, body, res }) => idempotentAnswer(res, await orders.createOrder(params.orgId, user, body)),
  );
  routes.get(
    "/api/orgs/:orgId/audit-orders",
    {
      summary: "Audit orders you placed, carry out, or whose lots are yours",
      access: READERS,
      params: orgParams,
      query: auditListQuerySchema,
    },
    ({ params, query }) => orders.listOrders(params.orgId, query),
  );
  routes.get(
    "/api/orgs/:orgId/audit-orders/:orderId",
    { summary: "One audit order: lines, payments (buyer only), lots, comparisons and verdicts", access: READERS, params: orderParams },
    ({ params, membership }) => orders.getOrder(params.orgId, params.orderId, membership!),
  );
  routes.post(
    "/api/orgs/:orgId/audit-orders/:orderId/checkout",
    {
      summary: "Open the hosted payment page (one Stripe Checkout Session per order)",
      access: FINANCE,
      params: orderParams,
      errors: { 409: "nothing to pay", 502: "payment service error" },
    },
    ({ params, user }) => orders.startCheckout(params.orgId, params.orderId, user),
  );
  routes.post(
    "/api/orgs/:orgId/audit-orders/:orderId/refund",
    {
      summary: "Refund a paid order whose results are not in (recorded when Stripe confirms)",
      access: FINANCE,
      params: orderParams,
      body: z.object({ reason: z.string().trim().min(3, { error: "Give a reason for the refund." }).max(500) }),
      status: 202,
      errors: { 409: "not refundable", 502: "payment service error" },
    },
    ({ params, user, body }) => orders.requestRefund(params.orgId, params.orderId, user, body.reason),
  );
  routes.get(
    "/api/orgs/:orgId/audit-orders/:orderId/invoice.pdf",
    { summary: "The order's invoice, or its receipt once paid", access: BUYERS, params: orderParams, produces: "application/pdf" },
    async ({ params, membership, res }) => {
      const { filename, pdf } = await invoicePdf(params.orgId, params.orderId, membership!.role);
      res.status(200).type("application/pdf").attachment(filename).send(pdf);
    },
  );
  routes.post(
    "/api/orgs/:orgId/audit-orders/:orderId/results",
    {
      summary: "The laboratory submits its results for a paid order (idempotent by key)",
      access: allowed("audits.report"),
      params: orderParams,
      body: labResultsSchema,
      status: 201,
      errors: { 409: "not awaiting results, or key reused" },
    },
    async ({ params, user, body, res }) => idempotentAnswer(res, await submitLabResults(params.orgId, params.orderId, user, body)),
  );
  routes.get(
    "/api/orgs/:orgId/audit-dashboard",
    {
      summary: "Spend per producer and month, outstanding and refunded",
      access: FINANCE,
      params: orgParams,
      query: auditListQuerySchema.pick({ from: true, to: true }),
    },
    ({ params, query }) => financeDashboard(params.orgId, query),
  );
}
