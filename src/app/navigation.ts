/** The app's navigation, and which roles see each entry. */
import type { OrganisationKind } from "../../shared/auth/roles.ts";
import { can, type Permission } from "../../shared/auth/permissions.ts";
import type { SessionMembership, SessionUser } from "../lib/session.ts";

export interface NavItem {
  label: string;
  to: string;
  /** The permission (shared/auth/permissions.ts) a member needs to see this item; undefined means every member. */
  permission?: Permission;
  /** Kinds of organisation whose members see this item; undefined means every kind. */
  kinds?: readonly OrganisationKind[];
  platformAdminOnly?: boolean;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { label: "Overview", to: "/" },
  { label: "Specifications", to: "/specs", permission: "specs.read", kinds: ["retailer", "producer"] },
  { label: "Lots", to: "/lots", permission: "lots.read", kinds: ["retailer", "producer"] },
  { label: "Readiness", to: "/readiness", permission: "lots.readiness" },
  { label: "Deviations", to: "/deviations", permission: "deviations.read" },
  { label: "Audits", to: "/audits", permission: "audits.read" },
  { label: "Members", to: "/members", permission: "members.manage" },
  { label: "Trail", to: "/activity", permission: "trail.organisation" },
  { label: "Price list", to: "/price-list", permission: "prices.manage", kinds: ["laboratory"] },
  { label: "Organisations", to: "/platform/organisations", platformAdminOnly: true },
  { label: "Profile", to: "/profile" },
];

export function visibleNav(user: SessionUser, membership: SessionMembership | undefined): NavItem[] {
  return NAV_ITEMS.filter((item) => {
    if (item.platformAdminOnly) return user.isPlatformAdmin;
    if (item.kinds && (!membership || !item.kinds.includes(membership.organisationKind))) return false;
    if (!item.permission) return true;
    return can(membership?.role, item.permission);
  });
}
