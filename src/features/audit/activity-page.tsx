import { useQuery } from "@tanstack/react-query";
import { api } from "../../lib/api-client.ts";
import type { AuditEntryView as AuditEntry } from "../../../shared/auth/views.ts";
import { useShellContext } from "../../app/use-shell-context.ts";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, ErrorState, LoadingState } from "../../components/ui/states.tsx";

const ACTION_LABELS: Record<string, string> = {
  "auth.sign_in": "Signed in",
  "invitation.created": "Invitation sent",
  "invitation.accepted": "Invitation accepted",
  "invitation.revoked": "Invitation revoked",
  "membership.role_changed": "Role changed",
  "membership.removed": "Member removed",
  "organisation.created": "Organisation opened",
};

export function ActivityPage() {
  const { membership } = useShellContext();
  const orgId = membership?.organisationId;
  const entries = useQuery({
    queryKey: ["orgs", orgId, "audit"],
    queryFn: () => api<AuditEntry[]>(`/api/orgs/${orgId}/audit?limit=200`),
    enabled: orgId !== undefined && membership?.role === "org_admin",
  });
  if (!membership || membership.role !== "org_admin") return <EmptyState title="Only an organisation admin sees the activity log." />;
  return (
    <>
      <PageHeader title="Activity log" lead="Recent recorded events of your organisation. Each entry is chained to the previous one by its SHA-256 hash, so later changes show." />
      <Card>
        {entries.isPending && <LoadingState />}
        {entries.isError && <ErrorState error={entries.error} onRetry={() => entries.refetch()} />}
        {entries.data?.length === 0 && <EmptyState title="Nothing recorded yet." />}
        {entries.data && entries.data.length > 0 && (
          <table className="w-full text-left text-sm">
            <thead className="border-b border-line text-ink-500">
              <tr>
                <th scope="col" className="py-2 pr-4 font-semibold">#</th>
                <th scope="col" className="py-2 pr-4 font-semibold">When (UTC)</th>
                <th scope="col" className="py-2 pr-4 font-semibold">Who</th>
                <th scope="col" className="py-2 pr-4 font-semibold">What</th>
                <th scope="col" className="py-2 pr-4 font-semibold">Details</th>
                <th scope="col" className="py-2 font-semibold">Hash</th>
              </tr>
            </thead>
            <tbody>
              {entries.data.map((e) => (
                <tr key={e.seq} className="border-b border-line/60 align-top">
                  <td className="py-2 pr-4 tabular-nums">{e.seq}</td>
                  <td className="py-2 pr-4 tabular-nums">{e.occurredAt.replace("T", " ").slice(0, 19)}</td>
                  <td className="py-2 pr-4">{e.actorName ?? "—"}</td>
                  <td className="py-2 pr-4">{ACTION_LABELS[e.action] ?? e.action}</td>
                  <td className="py-2 pr-4 text-ink-700">
                    {e.details ? Object.entries(e.details).map(([k, v]) => `${k}: ${String(v)}`).join(", ") : "—"}
                  </td>
                  <td className="py-2 font-mono text-xs text-ink-500">{e.hash.slice(0, 12)}…</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </Card>
    </>
  );
}
