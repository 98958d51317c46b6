/** The signed-in user as the API describes it, shared by server and client. */
import type { OrganisationKind, Role } from "./roles.ts";

export interface SessionMembership {
  membershipId: number;
  organisationId: number;
  organisationName: string;
  organisationKind: OrganisationKind;
  role: Role;
}

export interface SessionUser {
  id: number;
  email: string;
  name: string;
  isPlatformAdmin: boolean;
  memberships: SessionMembership[];
}
