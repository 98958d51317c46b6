import { z } from "zod";
import type { RouteRegistry } from "../http/route-registry.ts";
import { allowed, PLATFORM_ADMIN } from "../http/access.ts";
import { changeRoleSchema, createOrganisationSchema, inviteSchema } from "../../shared/auth/schemas.ts";
import { idParam } from "../../shared/ids.ts";
import * as members from "../services/member-service.ts";
import * as invitations from "../services/invitation-service.ts";
import * as organisations from "../services/organisation-service.ts";
import { verifyTrailChain } from "../services/trail/trail-service.ts";

const orgParams = z.object({ orgId: idParam });
const memberParams = orgParams.extend({ membershipId: idParam });
const invitationParams = orgParams.extend({ invitationId: idParam });

export function registerOrganisationRoutes(r: RouteRegistry): void {
  r.add(
    {
      method: "get",
      path: "/api/orgs/:orgId",
      tag: "organisations",
      summary: "Your organisation",
      access: allowed("organisation.read"),
      params: orgParams,
    },
    ({ params }) => organisations.getOrganisation(params.orgId),
  );

  r.add(
    {
      method: "get",
      path: "/api/orgs/:orgId/members",
      tag: "members",
      summary: "Members of your organisation",
      access: allowed("organisation.read"),
      params: orgParams,
    },
    ({ params }) => members.listMembers(params.orgId),
  );

  r.add(
    {
      method: "patch",
      path: "/api/orgs/:orgId/members/:membershipId",
      tag: "members",
      summary: "Change a member's role",
      access: allowed("members.manage"),
      params: memberParams,
      body: changeRoleSchema,
      errors: { 409: "would leave no admin" },
    },
    ({ params, body, user }) => members.changeRole(params.orgId, params.membershipId, body.role, user.id),
  );

  r.add(
    {
      method: "delete",
      path: "/api/orgs/:orgId/members/:membershipId",
      tag: "members",
      summary: "Remove a member",
      access: allowed("members.manage"),
      params: memberParams,
      errors: { 409: "would leave no admin" },
    },
    ({ params, user }) => members.removeMember(params.orgId, params.membershipId, user.id),
  );

  r.add(
    {
      method: "get",
      path: "/api/orgs/:orgId/invitations",
      tag: "members",
      summary: "Open invitations",
      access: allowed("members.manage"),
      params: orgParams,
    },
    ({ params }) => invitations.listOpenInvitations(params.orgId),
  );

  r.add(
    {
      method: "post",
      path: "/api/orgs/:orgId/invitations",
      tag: "members",
      summary: "Invite someone by e-mail",
      access: allowed("members.manage"),
      params: orgParams,
      body: inviteSchema,
      status: 201,
      errors: { 409: "already a member or invited" },
    },
    ({ params, body, user }) => invitations.invite(params.orgId, user, body.email, body.role),
  );

  r.add(
    {
      method: "delete",
      path: "/api/orgs/:orgId/invitations/:invitationId",
      tag: "members",
      summary: "Revoke an open invitation",
      access: allowed("members.manage"),
      params: invitationParams,
    },
    ({ params, user }) => invitations.revokeInvitation(params.orgId, params.invitationId, user.id),
  );

  r.add({ method: "get", path: "/api/platform/organisations", tag: "platform", summary: "All organisations", access: PLATFORM_ADMIN }, () =>
    organisations.listOrganisations(),
  );

  r.add(
    {
      method: "post",
      path: "/api/platform/organisations",
      tag: "platform",
      summary: "Open an organisation and invite its first admin",
      access: PLATFORM_ADMIN,
      body: createOrganisationSchema,
      status: 201,
      errors: { 409: "name taken" },
    },
    ({ body, user }) => organisations.createOrganisation(body, user),
  );

  r.add(
    {
      method: "get",
      path: "/api/platform/trail/verify",
      tag: "platform",
      summary: "Verify the whole trail's hash chain",
      access: PLATFORM_ADMIN,
    },
    () => verifyTrailChain(),
  );
}
