import { z } from "zod";
import { pageQuery } from "../../shared/paging.ts";
import multer from "multer";
import type { RouteRegistry } from "../http/route-registry.ts";
import { allowed, SIGNED_IN } from "../http/access.ts";
import { idParam } from "../../shared/ids.ts";
import {
  decisionSchema,
  deviationListQuerySchema,
  editMessageSchema,
  manualDeviationSchema,
  messageSchema,
  preferencesSchema,
} from "../../shared/deviations/schemas.ts";
import * as queries from "../services/deviations/deviation-queries.ts";
import * as commands from "../services/deviations/deviation-commands.ts";
import { deviationPdf } from "../services/deviations/deviation-pdf.ts";
import * as notifications from "../services/notification-service.ts";
import { badRequest } from "../errors.ts";

const orgParams = z.object({ orgId: idParam });
const devParams = orgParams.extend({ deviationId: idParam });
// The laboratory reads the deviations its audit results opened.
const PARTIES = allowed("deviations.read");
const DISCUSSANTS = allowed("deviations.discuss");
const BUYER = allowed("deviations.decide");

export function registerDeviationRoutes(r: RouteRegistry, opts: { attachmentMaxBytes: number }): void {
  const deviationsRoutes = r.section("deviations");
  const notificationsRoutes = r.section("notifications");
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: opts.attachmentMaxBytes, files: 1, fields: 0 } }).single(
    "file",
  );

  deviationsRoutes.get(
    "/api/orgs/:orgId/deviations",
    { summary: "Deviations on your contracts", access: PARTIES, params: orgParams, query: deviationListQuerySchema },
    ({ params, query, membership }) => queries.listDeviations(params.orgId, query, membership!.organisationKind),
  );
  deviationsRoutes.post(
    "/api/orgs/:orgId/deviations",
    {
      summary: "Open a deviation by hand, with a reason",
      access: DISCUSSANTS,
      params: orgParams,
      body: manualDeviationSchema,
      status: 201,
    },
    ({ params, user, body }) => commands.openManualDeviation(params.orgId, user, body),
  );
  deviationsRoutes.get(
    "/api/orgs/:orgId/deviations/:deviationId",
    { summary: "One deviation with the verdicts that opened it and its discussion", access: PARTIES, params: devParams },
    ({ params, user, membership }) => queries.getDeviation(params.orgId, params.deviationId, user, membership!),
  );
  deviationsRoutes.post(
    "/api/orgs/:orgId/deviations/:deviationId/messages",
    {
      summary: "Comment, reply, propose an outcome or accept a proposal",
      access: DISCUSSANTS,
      params: devParams,
      body: messageSchema,
      status: 201,
      errors: { 409: "already decided" },
    },
    ({ params, user, body }) => commands.postMessage(params.orgId, params.deviationId, user, body),
  );
  deviationsRoutes.patch(
    "/api/orgs/:orgId/deviations/:deviationId/messages/:messageId",
    {
      summary: "Edit your message (the earlier wording is kept)",
      access: DISCUSSANTS,
      params: devParams.extend({ messageId: idParam }),
      body: editMessageSchema,
    },
    ({ params, user, body }) => commands.editMessage(params.orgId, params.deviationId, params.messageId, user, body.body),
  );
  deviationsRoutes.post(
    "/api/orgs/:orgId/deviations/:deviationId/messages/:messageId/attachments",
    {
      summary: "Attach a PDF or image to your message",
      access: DISCUSSANTS,
      params: devParams.extend({ messageId: idParam }),
      consumes: "multipart/form-data",
      before: upload,
      status: 201,
      errors: { 413: "file too large", 415: "not a PDF or image" },
    },
    ({ params, user, req }) => {
      if (!req.file) throw badRequest('Send the file as multipart/form-data in the field "file".');
      return commands.attachToMessage(params.orgId, params.deviationId, params.messageId, user, req.file);
    },
  );
  deviationsRoutes.get(
    "/api/orgs/:orgId/deviation-attachments/:attachmentId",
    {
      summary: "Download an attachment",
      access: PARTIES,
      params: orgParams.extend({ attachmentId: idParam }),
      produces: "application/octet-stream",
    },
    async ({ params, res }) => {
      const a = await queries.readAttachment(params.orgId, params.attachmentId);
      // attachment() would set the type from the file name; the type detected at upload goes last and wins.
      res.status(200).attachment(a.filename).type(a.mime).send(a.body);
    },
  );
  deviationsRoutes.post(
    "/api/orgs/:orgId/deviations/:deviationId/decision",
    {
      summary: "Decide a deviation, with a reason (buyer's technologist)",
      access: BUYER,
      params: devParams,
      body: decisionSchema,
      errors: { 409: "already decided" },
    },
    ({ params, user, body }) => commands.decide(params.orgId, params.deviationId, user, body),
  );
  deviationsRoutes.post(
    "/api/orgs/:orgId/deviations/:deviationId/close",
    { summary: "Close a decided deviation once its conditions are met", access: BUYER, params: devParams, errors: { 409: "not decided" } },
    ({ params, user }) => commands.closeDeviation(params.orgId, params.deviationId, user),
  );
  deviationsRoutes.get(
    "/api/orgs/:orgId/deviations/:deviationId/pdf",
    { summary: "The deviation record as a PDF", access: PARTIES, params: devParams, produces: "application/pdf" },
    async ({ params, user, membership, res }) => {
      const { filename, pdf } = await deviationPdf(params.orgId, params.deviationId, user, membership!);
      res.status(200).type("application/pdf").attachment(filename).send(pdf);
    },
  );

  notificationsRoutes.get(
    "/api/me/notifications",
    { summary: "A page of your notifications, newest first, with the unread count", access: SIGNED_IN, query: z.object(pageQuery) },
    ({ user, query }) => notifications.listNotifications(user.id, query),
  );
  notificationsRoutes.post(
    "/api/me/notifications/read",
    {
      summary: "Mark notifications read",
      access: SIGNED_IN,
      body: z.object({ ids: z.union([z.literal("all"), z.array(z.number().int().positive()).max(500)]) }),
    },
    ({ user, body }) => notifications.markRead(user.id, body.ids),
  );
  notificationsRoutes.get("/api/me/notification-preferences", { summary: "Your notification preferences", access: SIGNED_IN }, ({ user }) =>
    notifications.preferencesOf(user.id),
  );
  notificationsRoutes.put(
    "/api/me/notification-preferences",
    { summary: "Choose e-mail now, a daily digest or none, and which kinds", access: SIGNED_IN, body: preferencesSchema },
    ({ user, body }) => notifications.setPreferences(user.id, body),
  );
}
