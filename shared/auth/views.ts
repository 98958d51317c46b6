/** Shapes of the organisation API's answers, shared by server and client. */
import type { OrganisationKind, Role } from "./roles.ts";

export interface MemberView {
  membershipId: number;
  userId: number;
  name: string;
  email: string;
  role: Role;
  since: string;
}

export interface InvitationView {
  id: number;
  email: string;
  role: Role;
  expiresAt: string;
  createdAt: string;
}

export interface OrganisationView {
  id: number;
  name: string;
  kind: OrganisationKind;
  country: string;
  memberCount: number;
  createdAt: string;
}
