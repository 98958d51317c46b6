import { Link } from "react-router-dom";
import { useSignedIn } from "../../lib/signed-in.tsx";
import { ORGANISATION_KIND_LABELS, ROLE_LABELS, type Role } from "../../../shared/auth/roles.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState } from "../../components/ui/states.tsx";
import { DueLotsCard } from "./due-lots-card.tsx";
import { can } from "../../../shared/auth/permissions.ts";

/** What each role does on Cellarpact, in the trade's words. */
const ROLE_PURPOSE: Record<Role, string> = {
  buyer_technologist: "You write the technical specification each wine must meet, per destination market, and decide on deviations.",
  buyer_finance: "You order and pay for independent compliance audits of producers' lots.",
  producer_quality: "You submit each lot's analysis against the agreed specification before filling and shipping.",
  lab_analyst: "You analyse audit samples you have been paid to test and report the results with their uncertainty.",
  org_admin: "You manage who from your organisation works on Cellarpact and in which role.",
};

/** Where each role's daily work starts. */
const ROLE_START: Record<Role, { to: string; label: string }> = {
  buyer_technologist: { to: "/specs", label: "Specifications" },
  buyer_finance: { to: "/audits", label: "Order and pay for audits" },
  producer_quality: { to: "/readiness", label: "Lots due for filling or shipment" },
  lab_analyst: { to: "/audits?status=paid", label: "Paid orders awaiting your results" },
  org_admin: { to: "/members", label: "Manage members" },
};

export function HomePage() {
  const { user, membership } = useSignedIn();
  return (
    <>
      <PageHeader
        title={`Welcome, ${user.name.split(" ")[0]}`}
        lead="Cellarpact keeps buyers and producers on the same technical specification, lot after lot."
      />
      <div className="grid gap-6 md:grid-cols-2">
        {membership ? (
          <Card title={membership.organisationName}>
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 text-sm">
              <dt className="text-ink-500">Kind</dt>
              <dd>{ORGANISATION_KIND_LABELS[membership.organisationKind]}</dd>
              <dt className="text-ink-500">Your role</dt>
              <dd>{ROLE_LABELS[membership.role]}</dd>
            </dl>
            <p className="mt-4 text-sm text-ink-700">{ROLE_PURPOSE[membership.role]}</p>
            <Link to={ROLE_START[membership.role].to} className="mt-4 inline-block text-sm font-semibold text-must-700 underline">
              {ROLE_START[membership.role].label}
            </Link>
          </Card>
        ) : (
          <EmptyState title="You do not belong to an organisation yet.">
            {user.isPlatformAdmin ? "As platform admin you can open organisations." : "Ask an organisation admin to invite you."}
          </EmptyState>
        )}
        {membership && can(membership.role, "lots.readiness") && <DueLotsCard orgId={membership.organisationId} />}
        {user.isPlatformAdmin && (
          <Card title="Platform administration">
            <p className="text-sm text-ink-700">
              Open organisations for new retailers, producers and laboratories, and check the trail's hash chain.
            </p>
            <Link to="/platform/organisations" className="mt-4 inline-block text-sm font-semibold text-must-700 underline">
              Organisations
            </Link>
          </Card>
        )}
      </div>
    </>
  );
}
