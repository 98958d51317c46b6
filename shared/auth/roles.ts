/** The kinds of organisation on the portal and the roles their members can hold. */
export const ORGANISATION_KINDS = ["retailer", "producer", "laboratory"] as const;
export type OrganisationKind = (typeof ORGANISATION_KINDS)[number];

export const ROLES = ["buyer_technologist", "buyer_finance", "producer_quality", "lab_analyst", "org_admin"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  buyer_technologist: "Buyer technologist",
  buyer_finance: "Buyer finance",
  producer_quality: "Producer quality",
  lab_analyst: "Laboratory analyst",
  org_admin: "Organisation admin",
};

export const ORGANISATION_KIND_LABELS: Record<OrganisationKind, string> = {
  retailer: "Retailer (buyer)",
  producer: "Producer",
  laboratory: "Laboratory",
};

/** Which roles make sense in which kind of organisation; the admin role exists everywhere. */
export const ROLES_BY_KIND: Record<OrganisationKind, readonly Role[]> = {
  retailer: ["buyer_technologist", "buyer_finance", "org_admin"],
  producer: ["producer_quality", "org_admin"],
  laboratory: ["lab_analyst", "org_admin"],
};

export function roleFitsKind(role: Role, kind: OrganisationKind): boolean {
  return ROLES_BY_KIND[kind].includes(role);
}
