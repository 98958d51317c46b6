/** The app's navigation, and which roles see each entry. */
import type { OrganisationKind, Role } from "../../shared/auth/roles.ts";
import type { SessionMembership, SessionUser } from "../lib/session.ts";

export interface NavItem {
  label: string;
  to: string;
  /** Organisation roles that see this item; undefined means every member. */
  roles?: readonly Role[];
  /** Kinds of organisation whose members see this item; undefined means every kind. */
  kinds?: readonly OrganisationKind[];
  platformAdminOnly?: boolean;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { label: "Overview", to: "/" },
  { label: "Specifications", to: "/specs", roles: ["buyer_technologist", "buyer_finance", "producer_quality"] },
  { label: "Lots", to: "/lots", roles: ["buyer_technologist", "buyer_finance", "producer_quality"] },
  { label: "Readiness", to: "/readiness", roles: ["buyer_technologist", "producer_quality"] },
  { label: "Deviations", to: "/deviations", roles: ["buyer_technologist", "buyer_finance", "producer_quality", "lab_analyst"] },
  { label: "Audits", to: "/audits", roles: ["buyer_technologist", "buyer_finance", "producer_quality", "lab_analyst"] },
  { label: "Members", to: "/members", roles: ["org_admin"] },
  { label: "Trail", to: "/activity", roles: ["org_admin"] },
  { label: "Price list", to: "/price-list", roles: ["org_admin"], kinds: ["laboratory"] },
  { label: "Organisations", to: "/platform/organisations", platformAdminOnly: true },
  { label: "Profile", to: "/profile" },
];

export function visibleNav(user: SessionUser, membership: SessionMembership | undefined): NavItem[] {
  return NAV_ITEMS.filter((item) => {
    if (item.platformAdminOnly) return user.isPlatformAdmin;
    if (item.kinds && (!membership || !item.kinds.includes(membership.organisationKind))) return false;
    if (!item.roles) return true;
    return membership !== undefined && item.roles.includes(membership.role);
  });
}
