import { z } from "zod";
import type { RouteRegistry } from "../http/route-registry.ts";
import { allowed } from "../http/access.ts";
import { validationFailed } from "../errors.ts";
import { idParam } from "../../shared/ids.ts";
import {
  backtestQuerySchema,
  commentSchema,
  newContractSchema,
  newVersionSchema,
  requestChangesSchema,
  specDraftSchema,
  specListQuerySchema,
} from "../../shared/specs/schemas.ts";
import * as queries from "../services/specs/spec-queries.ts";
import * as lifecycle from "../services/specs/spec-lifecycle.ts";
import { specSheetPdf } from "../services/specs/spec-pdf.ts";
import { acceptContract, createContract, listProducers, updateLawFacts } from "../services/specs/contract-service.ts";
import { lawFactsUpdateSchema } from "../../shared/specs/law-facts.ts";

const orgParams = z.object({ orgId: idParam });
const contractParams = orgParams.extend({ contractId: idParam });
const specParams = orgParams.extend({ specId: idParam });
const BUYER = allowed("specs.draft");
const PRODUCER = allowed("specs.decide");
const PARTIES = allowed("specs.read");
const COMMENTERS = allowed("specs.comment");

export function registerSpecRoutes(r: RouteRegistry): void {
  const routes = r.section("specs");
  routes.get(
    "/api/orgs/:orgId/contracts",
    { summary: "Contracts your organisation is party to, with their versions", access: PARTIES, params: orgParams },
    ({ params }) => queries.listContracts(params.orgId),
  );

  routes.post(
    "/api/orgs/:orgId/contracts",
    {
      summary: "Open a contract for a wine bought from a producer",
      access: BUYER,
      params: orgParams,
      body: newContractSchema,
      status: 201,
      errors: { 409: "reference taken" },
    },
    ({ params, body, user, membership }) => {
      if (membership!.organisationKind !== "retailer")
        throw validationFailed([{ path: "(body)", message: "Only a retailer opens purchasing contracts." }]);
      return createContract(params.orgId, user, body);
    },
  );

  routes.get("/api/orgs/:orgId/producers", { summary: "Producers a buyer can contract with", access: BUYER, params: orgParams }, () =>
    listProducers(),
  );

  routes.get(
    "/api/orgs/:orgId/contracts/:contractId",
    { summary: "One contract with its spec versions", access: PARTIES, params: contractParams },
    ({ params, membership }) => queries.getContract(params.orgId, params.contractId, membership!.role),
  );

  routes.post(
    "/api/orgs/:orgId/contracts/:contractId/accept",
    {
      summary: "The producer's admin accepts the contract, so that its spec versions can reach the producer",
      access: allowed("contracts.accept"),
      params: contractParams,
      status: 204,
      errors: { 403: "not the producer", 409: "accepted already" },
    },
    ({ params, user }) => acceptContract(params.orgId, params.contractId, user),
  );

  routes.put(
    "/api/orgs/:orgId/contracts/:contractId/law-facts",
    {
      summary: "State the wine's facts the law asks (organic, PDO/PGI, listings for higher limits)",
      access: BUYER,
      params: contractParams,
      body: lawFactsUpdateSchema,
      errors: { 403: "not the buyer" },
    },
    ({ params, body, user }) => updateLawFacts(params.orgId, params.contractId, user, body.lawFacts),
  );

  routes.get(
    "/api/orgs/:orgId/contracts/:contractId/results",
    {
      summary: "Past results of the contract's last lots, for the named parameters (for backtests)",
      access: PARTIES,
      params: contractParams,
      query: backtestQuerySchema,
    },
    ({ params, query }) => queries.pastResults(params.orgId, params.contractId, query),
  );

  routes.post(
    "/api/orgs/:orgId/contracts/:contractId/specs",
    {
      summary: "Start a new draft version: blank, from a template or from an earlier version",
      access: BUYER,
      params: contractParams,
      body: newVersionSchema,
      status: 201,
    },
    ({ params, body, user }) => lifecycle.createVersion(params.orgId, params.contractId, user, body),
  );

  routes.get(
    "/api/orgs/:orgId/specs",
    {
      summary: "Spec versions, filtered by wine, producer, market, status or text",
      access: PARTIES,
      params: orgParams,
      query: specListQuerySchema,
    },
    ({ params, query }) => queries.listSpecs(params.orgId, query),
  );

  routes.get(
    "/api/orgs/:orgId/specs/:specId",
    { summary: "One version with its requirements, comments and what you may do", access: PARTIES, params: specParams },
    ({ params, membership }) => queries.getVersion(params.orgId, params.specId, membership!.role),
  );

  routes.put(
    "/api/orgs/:orgId/specs/:specId",
    {
      summary: "Save a draft (optimistic locking on lockVersion)",
      access: BUYER,
      params: specParams,
      body: specDraftSchema,
      errors: { 409: "stale save, or the version was sent" },
    },
    ({ params, body, user }) => lifecycle.saveDraft(params.orgId, params.specId, user, body),
  );

  routes.post(
    "/api/orgs/:orgId/specs/:specId/send",
    { summary: "Send a draft to the producer; it can no longer change", access: BUYER, params: specParams, errors: { 409: "not a draft" } },
    ({ params, user }) => lifecycle.sendToProducer(params.orgId, params.specId, user),
  );

  routes.post(
    "/api/orgs/:orgId/specs/:specId/withdraw",
    { summary: "Withdraw a sent or agreed version", access: BUYER, params: specParams, errors: { 409: "not withdrawable" } },
    ({ params, user }) => lifecycle.withdraw(params.orgId, params.specId, user),
  );

  routes.post(
    "/api/orgs/:orgId/specs/:specId/agree",
    { summary: "Agree to a version (producer)", access: PRODUCER, params: specParams, errors: { 409: "not waiting for the producer" } },
    ({ params, user }) => lifecycle.agree(params.orgId, params.specId, user),
  );

  routes.post(
    "/api/orgs/:orgId/specs/:specId/request-changes",
    {
      summary: "Ask the buyer for changes (producer)",
      access: PRODUCER,
      params: specParams,
      body: requestChangesSchema,
      errors: { 409: "not waiting for the producer" },
    },
    ({ params, body, user }) => lifecycle.requestChanges(params.orgId, params.specId, user, body.reason),
  );

  routes.post(
    "/api/orgs/:orgId/specs/:specId/comments",
    {
      summary: "Comment on a version or one of its rows",
      access: COMMENTERS,
      params: specParams,
      body: commentSchema,
      status: 201,
      errors: { 409: "comments closed" },
    },
    ({ params, body, user }) => lifecycle.addComment(params.orgId, params.specId, user, body),
  );

  routes.get(
    "/api/orgs/:orgId/specs/:specId/diff",
    {
      summary: "Diff against another version of the same contract",
      access: PARTIES,
      params: specParams,
      query: z.object({ against: idParam }),
    },
    ({ params, query }) => queries.diffVersions(params.orgId, params.specId, query.against),
  );

  routes.get(
    "/api/orgs/:orgId/specs/:specId/pdf",
    { summary: "The spec sheet as a PDF", access: PARTIES, params: specParams, produces: "application/pdf" },
    async ({ params, membership, res }) => {
      const { filename, pdf } = await specSheetPdf(params.orgId, params.specId, membership!.role);
      res.status(200).type("application/pdf").attachment(filename).send(pdf);
    },
  );
}
