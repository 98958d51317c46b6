/**
 * Who may see and do what, in one table: the server's access rules, the client's navigation and
 * every button read it. A permission names a capability; the organisation and the side of the
 * contract are checked on top of it (a buyer's technologist drafts only their own organisation's
 * specs).
 */
import { ROLES, type Role } from "./roles.ts";

const BUYER_TECH = "buyer_technologist";
const BUYER_FINANCE = "buyer_finance";
const PRODUCER = "producer_quality";
const LAB = "lab_analyst";
const ADMIN = "org_admin";

export const PERMISSIONS = {
  /** The organisation itself and its members' names. */
  "organisation.read": ROLES,
  "members.manage": [ADMIN],
  /** Accept a contract a retailer opened with the organisation (a producer's admin). */
  "contracts.accept": [ADMIN],
  "specs.read": [BUYER_TECH, BUYER_FINANCE, PRODUCER, ADMIN],
  /** Open contracts, draft, send and withdraw spec versions, state a wine's facts for the law. */
  "specs.draft": [BUYER_TECH],
  /** Agree to a spec version or send it back. */
  "specs.decide": [PRODUCER],
  "specs.comment": [BUYER_TECH, PRODUCER],
  "lots.read": [BUYER_TECH, BUYER_FINANCE, PRODUCER, ADMIN],
  "lots.readiness": [BUYER_TECH, PRODUCER],
  /** Register and edit lots, submit and import results. */
  "lots.submit": [PRODUCER],
  "lots.rejudge": [BUYER_TECH, PRODUCER],
  "certificates.attach": [PRODUCER, LAB],
  "certificates.read": [BUYER_TECH, BUYER_FINANCE, PRODUCER, LAB, ADMIN],
  "deviations.read": [BUYER_TECH, BUYER_FINANCE, PRODUCER, LAB, ADMIN],
  /** Open a deviation by hand, write, propose, accept, attach. */
  "deviations.discuss": [BUYER_TECH, PRODUCER],
  /** Record the decision and close. */
  "deviations.decide": [BUYER_TECH],
  "audits.read": [BUYER_FINANCE, BUYER_TECH, PRODUCER, LAB],
  /** See the laboratories' offers and the invoices. */
  "audits.browse": [BUYER_FINANCE, BUYER_TECH],
  /** Order, pay, refund, and the finance dashboard. */
  "audits.order": [BUYER_FINANCE],
  "audits.report": [LAB],
  "prices.read": [LAB, ADMIN],
  "prices.manage": [ADMIN],
  "trail.organisation": [ADMIN],
  "trail.history": [BUYER_TECH, BUYER_FINANCE, PRODUCER, LAB, ADMIN],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export const rolesFor = (p: Permission): readonly Role[] => PERMISSIONS[p];

/** Whether a member with this role has the permission; no role (no membership) has none. */
export const can = (role: Role | undefined, p: Permission): boolean =>
  role !== undefined && (PERMISSIONS[p] as readonly Role[]).includes(role);
