import { z } from "zod";
import multer from "multer";
import type { RouteRegistry } from "../http/route-registry.ts";
import { idempotentAnswer } from "../http/idempotent-answer.ts";
import { allowed } from "../http/access.ts";
import { idParam } from "../../shared/ids.ts";
import {
  analysisSubmissionSchema,
  importBatchSchema,
  lotListQuerySchema,
  lotSchema,
  lotUpdateSchema,
  readinessQuerySchema,
  trendQuerySchema,
} from "../../shared/lots/schemas.ts";
import * as submissions from "../services/lots/submission-service.ts";
import * as queries from "../services/lots/lot-queries.ts";
import { readCertificate, storeCertificate } from "../services/lots/certificate-service.ts";
import { badRequest } from "../errors.ts";
import { lotDocument } from "../services/lots/conformity-service.ts";
import { rejudgeAnalysis } from "../services/lots/rejudge-service.ts";

const orgParams = z.object({ orgId: idParam });
const PRODUCER = allowed("lots.submit");
const PARTIES = allowed("lots.read");

export function registerLotRoutes(r: RouteRegistry, opts: { certificateMaxBytes: number }): void {
  const routes = r.section("lots");
  // Memory storage with a hard size limit; nothing reaches the disk before the content check passes.
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: opts.certificateMaxBytes, files: 1, fields: 0 } }).single(
    "file",
  );

  routes.get(
    "/api/orgs/:orgId/lots",
    {
      summary: "Lots on your contracts",
      access: PARTIES,
      params: orgParams,
      query: lotListQuerySchema,
    },
    ({ params, query }) => queries.listLots(params.orgId, query),
  );

  routes.post(
    "/api/orgs/:orgId/lots",
    { summary: "Register a lot under a contract (producer)", access: PRODUCER, params: orgParams, body: lotSchema, status: 201 },
    ({ params, user, body }) => submissions.registerLot(params.orgId, user, body),
  );

  routes.patch(
    "/api/orgs/:orgId/lots/:lotId",
    {
      summary: "Correct a lot's volume, container, planned date or market (producer)",
      access: PRODUCER,
      params: orgParams.extend({ lotId: idParam }),
      body: lotUpdateSchema,
    },
    ({ params, user, body }) => submissions.updateLot(params.orgId, params.lotId, user, body),
  );

  routes.get(
    "/api/orgs/:orgId/lots/:lotId",
    {
      summary: "One lot: governing spec, analyses with stored verdicts, certificates, transit, deviations",
      access: PARTIES,
      params: orgParams.extend({ lotId: idParam }),
    },
    ({ params, membership }) => queries.getLot(params.orgId, params.lotId, membership!.role),
  );

  routes.post(
    "/api/orgs/:orgId/lots/:lotId/analyses",
    {
      summary: "Submit one analysis; evaluated and stored at once (idempotent by key)",
      access: PRODUCER,
      params: orgParams.extend({ lotId: idParam }),
      body: analysisSubmissionSchema,
      status: 201,
      errors: { 409: "idempotency key reused with another body" },
    },
    async ({ params, user, body, res }) => idempotentAnswer(res, await submissions.submitAnalysis(params.orgId, params.lotId, user, body)),
  );

  routes.post(
    "/api/orgs/:orgId/lots/:lotId/analyses/:analysisId/rejudge",
    {
      summary: "Judge an analysis again against the spec version now in force (a new, recorded analysis; the first stays as it was)",
      access: allowed("lots.rejudge"),
      params: orgParams.extend({ lotId: idParam, analysisId: idParam }),
      status: 201,
      errors: { 409: "no later version governs, or already re-judged" },
    },
    ({ params, user }) => rejudgeAnalysis(params.orgId, params.lotId, params.analysisId, user),
  );

  routes.post(
    "/api/orgs/:orgId/contracts/:contractId/imports",
    {
      summary: "Import a batch of analyses from a CSV (idempotent by key)",
      access: PRODUCER,
      params: orgParams.extend({ contractId: idParam }),
      body: importBatchSchema,
      status: 201,
      errors: { 409: "idempotency key reused, or a lot's vintage differs" },
    },
    async ({ params, user, body, res }) =>
      idempotentAnswer(res, await submissions.importAnalyses(params.orgId, params.contractId, user, body)),
  );

  routes.post(
    "/api/orgs/:orgId/analyses/:analysisId/certificates",
    {
      summary:
        "Upload the laboratory's certificate (PDF, PNG or JPEG, checked by content): the producer for its analyses, the audit laboratory for its own",
      access: allowed("certificates.attach"),
      params: orgParams.extend({ analysisId: idParam }),
      consumes: "multipart/form-data",
      before: upload,
      status: 201,
      errors: { 413: "file too large", 415: "not a PDF or image" },
    },
    ({ params, user, req }) => {
      if (!req.file) throw badRequest('Send the certificate as multipart/form-data in the field "file".');
      return storeCertificate(params.orgId, params.analysisId, user, req.file);
    },
  );

  routes.get(
    "/api/orgs/:orgId/certificates/:certificateId",
    {
      summary: "Download a certificate",
      access: allowed("certificates.read"),
      params: orgParams.extend({ certificateId: idParam }),
      produces: "application/octet-stream",
    },
    async ({ params, res }) => {
      const c = await readCertificate(params.orgId, params.certificateId);
      // attachment() would set the type from the file name; the type detected at upload goes last and wins.
      res.status(200).attachment(c.filename).type(c.mime).setHeader("X-Content-Type-Options", "nosniff");
      res.send(c.body);
    },
  );

  routes.get(
    "/api/orgs/:orgId/lots/:lotId/conformity.pdf",
    {
      summary: "The lot's certificate of conformity, or its analysis statement when the lot's status allows no certificate",
      access: PARTIES,
      params: orgParams.extend({ lotId: idParam }),
      produces: "application/pdf",
      errors: { 409: "no results judged yet" },
    },
    async ({ params, user, membership, res }) => {
      const { filename, pdf } = await lotDocument(params.orgId, params.lotId, user!, membership!.role);
      res.status(200).type("application/pdf").attachment(filename).send(pdf);
    },
  );

  routes.get(
    "/api/orgs/:orgId/readiness",
    {
      summary: "Lots due within the horizon, soonest first and undated last: what is missing, what fails",
      access: PARTIES,
      params: orgParams,
      query: readinessQuerySchema,
    },
    ({ params, query }) => queries.readiness(params.orgId, query),
  );

  routes.get(
    "/api/orgs/:orgId/contracts/:contractId/trend",
    {
      summary: "One parameter across the contract's lots over its latest vintages",
      access: PARTIES,
      params: orgParams.extend({ contractId: idParam }),
      query: trendQuerySchema,
    },
    ({ params, query }) => queries.trend(params.orgId, params.contractId, query),
  );
}
