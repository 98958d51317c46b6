/** Access rules that every route declares, and the check that enforces them. */
import { rolesFor, type Permission } from "../../shared/auth/permissions.ts";
import type { SessionUser, SessionMembership } from "../services/session-service.ts";
import { forbidden, notFound, unauthorized } from "../errors.ts";
import { ROLE_LABELS } from "../../shared/auth/roles.ts";

export type Access =
  | { kind: "public" }
  | { kind: "signed-in" }
  | { kind: "platform-admin" }
  /** The caller must belong to the organisation in the :orgId path segment with a role the permission table gives this permission. */
  | { kind: "org-member"; permission: Permission };

export const PUBLIC: Access = { kind: "public" };
export const SIGNED_IN: Access = { kind: "signed-in" };
export const PLATFORM_ADMIN: Access = { kind: "platform-admin" };
/** A member of the organisation in the path who holds this permission (shared/auth/permissions.ts). */
export const allowed = (permission: Permission): Access => ({ kind: "org-member", permission });

export function describeAccess(access: Access): string {
  switch (access.kind) {
    case "public":
      return "public";
    case "signed-in":
      return "any signed-in user";
    case "platform-admin":
      return "platform admin";
    case "org-member":
      return `member of the organisation in the path with ${access.permission} (${rolesFor(access.permission).join(", ")})`;
  }
}

/** Returns the membership the rule relied on, if any. Non-members get 404 so other tenants stay invisible. */
export function enforceAccess(access: Access, user: SessionUser | null, orgId: number | undefined): SessionMembership | undefined {
  if (access.kind === "public") return undefined;
  if (!user) throw unauthorized();
  if (access.kind === "signed-in") return undefined;
  if (access.kind === "platform-admin") {
    if (!user.isPlatformAdmin) throw forbidden("Only a platform admin may do this.");
    return undefined;
  }
  const membership = user.memberships.find((m) => m.organisationId === orgId);
  if (!membership) throw notFound("The organisation");
  const roles = rolesFor(access.permission);
  if (!roles.includes(membership.role)) {
    const needed = roles.map((r) => ROLE_LABELS[r]).join(" or ");
    throw forbidden(`This needs the role ${needed}; you are ${ROLE_LABELS[membership.role]}.`);
  }
  return membership;
}
