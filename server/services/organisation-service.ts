/** Organisations as the platform admin sees them, and opening a new one with its first admin. */
import { fn, col } from "sequelize";
import { Organisation } from "../models/organisation.ts";
import { Membership } from "../models/membership.ts";
import { inTransaction } from "../db/database.ts";
import { recordTrail } from "./trail/trail-service.ts";
import { createInvitation, INVITATION_DAYS } from "./invitation-service.ts";
import { organisationWelcomeMail } from "../integrations/mail/templates.ts";
import { conflict, notFound } from "../errors.ts";
import type { CreateOrganisationInput } from "../../shared/auth/schemas.ts";
import type { SessionUser } from "./session-service.ts";
import type { OrganisationView } from "../../shared/auth/views.ts";

export async function listOrganisations(): Promise<OrganisationView[]> {
  const [orgs, counts] = await Promise.all([
    Organisation.findAll({ order: [["name", "ASC"]] }),
    Membership.findAll({
      attributes: ["organisationId", [fn("COUNT", col("id")), "n"]],
      group: ["organisationId"],
      raw: true,
    }) as unknown as Promise<{ organisationId: number; n: number }[]>,
  ]);
  const byOrg = new Map(counts.map((c) => [c.organisationId, Number(c.n)]));
  return orgs.map((o) => ({
    id: o.id,
    name: o.name,
    kind: o.kind,
    country: o.country,
    memberCount: byOrg.get(o.id) ?? 0,
    createdAt: o.createdAt.toISOString(),
  }));
}

export async function getOrganisation(orgId: number): Promise<OrganisationView> {
  const org = await Organisation.findByPk(orgId);
  if (!org) throw notFound("The organisation");
  const memberCount = await Membership.count({ where: { organisationId: orgId } });
  return { id: org.id, name: org.name, kind: org.kind, country: org.country, memberCount, createdAt: org.createdAt.toISOString() };
}

export async function createOrganisation(input: CreateOrganisationInput, actor: SessionUser): Promise<OrganisationView> {
  return inTransaction(async (t) => {
    if (await Organisation.findOne({ where: { name: input.name }, transaction: t })) {
      throw conflict(`An organisation named ${input.name} exists already.`);
    }
    const organisation = await Organisation.create({ name: input.name, kind: input.kind, country: input.country }, { transaction: t });
    await recordTrail(t, {
      actorUserId: actor.id,
      organisationId: organisation.id,
      action: "organisation.created",
      entityType: "organisation",
      entityId: organisation.id,
      after: { name: input.name, kind: input.kind, country: input.country },
      details: { name: input.name, kind: input.kind },
    });
    await createInvitation(t, { organisation, email: input.adminEmail, role: "org_admin", invitedBy: actor }, (link) =>
      organisationWelcomeMail({ to: input.adminEmail, organisationName: organisation.name, link, expiresDays: INVITATION_DAYS }),
    );
    return {
      id: organisation.id,
      name: organisation.name,
      kind: organisation.kind,
      country: organisation.country,
      memberCount: 0,
      createdAt: organisation.createdAt.toISOString(),
    };
  });
}
