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
  const organisationsRoutes = r.section("organisations");
  const membersRoutes = r.section("members");
  const platformRoutes = r.section("platform");
  organisationsRoutes.get(
    "/api/orgs/:orgId",
    { summary: "Your organisation", access: allowed("organisation.read"), params: orgParams },
    ({ params }) => organisations.getOrganisation(params.orgId),
  );

  membersRoutes.get(
    "/api/orgs/:orgId/members",
    { summary: "Members of your organisation", access: allowed("organisation.read"), params: orgParams },
    ({ params }) => members.listMembers(params.orgId),
  );

  membersRoutes.patch(
    "/api/orgs/:orgId/members/:membershipId",
    {
      summary: "Change a member's role",
      access: allowed("members.manage"),
      params: memberParams,
      body: changeRoleSchema,
      errors: { 409: "would leave no admin" },
    },
    ({ params, body, user }) => members.changeRole(params.orgId, params.membershipId, body.role, user.id),
  );

  membersRoutes.delete(
    "/api/orgs/:orgId/members/:membershipId",
    { summary: "Remove a member", access: allowed("members.manage"), params: memberParams, errors: { 409: "would leave no admin" } },
    ({ params, user }) => members.removeMember(params.orgId, params.membershipId, user.id),
  );

  membersRoutes.get(
    "/api/orgs/:orgId/invitations",
    { summary: "Open invitations", access: allowed("members.manage"), params: orgParams },
    ({ params }) => invitations.listOpenInvitations(params.orgId),
  );

  membersRoutes.post(
    "/api/orgs/:orgId/invitations",
    {
      summary: "Invite someone by e-mail",
      access: allowed("members.manage"),
      params: orgParams,
      body: inviteSchema,
      status: 201,
      errors: { 409: "already a member or invited" },
    },
    ({ params, body, user }) => invitations.invite(params.orgId, user, body.email, body.role),
  );

  membersRoutes.delete(
    "/api/orgs/:orgId/invitations/:invitationId",
    { summary: "Revoke an open invitation", access: allowed("members.manage"), params: invitationParams },
    ({ params, user }) => invitations.revokeInvitation(params.orgId, params.invitationId, user.id),
  );

  platformRoutes.get("/api/platform/organisations", { summary: "All organisations", access: PLATFORM_ADMIN }, () =>
    organisations.listOrganisations(),
  );

  platformRoutes.post(
    "/api/platform/organisations",
    {
      summary: "Open an organisation and invite its first admin",
      access: PLATFORM_ADMIN,
      body: createOrganisationSchema,
      status: 201,
      errors: { 409: "name taken" },
    },
    ({ body, user }) => organisations.createOrganisation(body, user),
  );

  platformRoutes.get("/api/platform/trail/verify", { summary: "Verify the whole trail's hash chain", access: PLATFORM_ADMIN }, () =>
    verifyTrailChain(),
  );
}
