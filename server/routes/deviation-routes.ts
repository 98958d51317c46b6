import { z } from "zod";
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
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: opts.attachmentMaxBytes, files: 1, fields: 0 } }).single(
    "file",
  );

  r.add(
    {
      method: "get",
      path: "/api/orgs/:orgId/deviations",
      tag: "deviations",
      summary: "Deviations on your contracts",
      access: PARTIES,
      params: orgParams,
      query: deviationListQuerySchema,
    },
    ({ params, query }) => queries.listDeviations(params.orgId, query),
  );
  r.add(
    {
      method: "post",
      path: "/api/orgs/:orgId/deviations",
      tag: "deviations",
      summary: "Open a deviation by hand, with a reason",
      access: DISCUSSANTS,
      params: orgParams,
      body: manualDeviationSchema,
      status: 201,
    },
    ({ params, user, body }) => commands.openManualDeviation(params.orgId, user, body),
  );
  r.add(
    {
      method: "get",
      path: "/api/orgs/:orgId/deviations/:deviationId",
      tag: "deviations",
      summary: "One deviation with the verdicts that opened it and its discussion",
      access: PARTIES,
      params: devParams,
    },
    ({ params, user, membership }) => queries.getDeviation(params.orgId, params.deviationId, user, membership!),
  );
  r.add(
    {
      method: "post",
      path: "/api/orgs/:orgId/deviations/:deviationId/messages",
      tag: "deviations",
      summary: "Comment, reply, propose an outcome or accept a proposal",
      access: DISCUSSANTS,
      params: devParams,
      body: messageSchema,
      status: 201,
      errors: { 409: "already decided" },
    },
    ({ params, user, body }) => commands.postMessage(params.orgId, params.deviationId, user, body),
  );
  r.add(
    {
      method: "patch",
      path: "/api/orgs/:orgId/deviations/:deviationId/messages/:messageId",
      tag: "deviations",
      summary: "Edit your message (the earlier wording is kept)",
      access: DISCUSSANTS,
      params: devParams.extend({ messageId: idParam }),
      body: editMessageSchema,
    },
    ({ params, user, body }) => commands.editMessage(params.orgId, params.deviationId, params.messageId, user, body.body),
  );
  r.add(
    {
      method: "post",
      path: "/api/orgs/:orgId/deviations/:deviationId/messages/:messageId/attachments",
      tag: "deviations",
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
  r.add(
    {
      method: "get",
      path: "/api/orgs/:orgId/deviation-attachments/:attachmentId",
      tag: "deviations",
      summary: "Download an attachment",
      access: PARTIES,
      params: orgParams.extend({ attachmentId: idParam }),
      produces: "application/octet-stream",
    },
    async ({ params, res }) => {
      const a = await queries.readAttachment(params.orgId, params.attachmentId);
      res.status(200).type(a.mime).attachment(a.filename).send(a.body);
    },
  );
  r.add(
    {
      method: "post",
      path: "/api/orgs/:orgId/deviations/:deviationId/decision",
      tag: "deviations",
      summary: "Decide a deviation, with a reason (buyer's technologist)",
      access: BUYER,
      params: devParams,
      body: decisionSchema,
      errors: { 409: "already decided" },
    },
    ({ params, user, body }) => commands.decide(params.orgId, params.deviationId, user, body),
  );
  r.add(
    {
      method: "post",
      path: "/api/orgs/:orgId/deviations/:deviationId/close",
      tag: "deviations",
      summary: "Close a decided deviation once its conditions are met",
      access: BUYER,
      params: devParams,
      errors: { 409: "not decided" },
    },
    ({ params, user }) => commands.closeDeviation(params.orgId, params.deviationId, user),
  );
  r.add(
    {
      method: "get",
      path: "/api/orgs/:orgId/deviations/:deviationId/pdf",
      tag: "deviations",
      summary: "The deviation record as a PDF",
      access: PARTIES,
      params: devParams,
      produces: "application/pdf",
    },
    async ({ params, user, membership, res }) => {
      const { filename, pdf } = await deviationPdf(params.orgId, params.deviationId, user, membership!);
      res.status(200).type("application/pdf").attachment(filename).send(pdf);
    },
  );

  r.add(
    { method: "get", path: "/api/me/notifications", tag: "notifications", summary: "Your notifications, newest first", access: SIGNED_IN },
    ({ user }) => notifications.listNotifications(user.id),
  );
  r.add(
    {
      method: "post",
      path: "/api/me/notifications/read",
      tag: "notifications",
      summary: "Mark notifications read",
      access: SIGNED_IN,
      body: z.object({ ids: z.union([z.literal("all"), z.array(z.number().int().positive()).max(500)]) }),
    },
    ({ user, body }) => notifications.markRead(user.id, body.ids),
  );
  r.add(
    {
      method: "get",
      path: "/api/me/notification-preferences",
      tag: "notifications",
      summary: "Your notification preferences",
      access: SIGNED_IN,
    },
    ({ user }) => notifications.preferencesOf(user.id),
  );
  r.add(
    {
      method: "put",
      path: "/api/me/notification-preferences",
      tag: "notifications",
      summary: "Choose e-mail now, a daily digest or none, and which kinds",
      access: SIGNED_IN,
      body: preferencesSchema,
    },
    ({ user, body }) => notifications.setPreferences(user.id, body),
  );
}
