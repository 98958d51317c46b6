import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { useConfirm } from "../../components/ui/confirm-dialog.tsx";
import { useSignedIn } from "../../lib/signed-in.tsx";
import { ROLE_LABELS, ROLES_BY_KIND, type Role } from "../../../shared/auth/roles.ts";
import { invitationsQueryOptions, membersQueryOptions, useChangeRole, useRemoveMember, useRevokeInvitation } from "./api/members.ts";
import { InviteForm } from "./invite-form.tsx";
import { Card, PageHeader } from "../../components/ui/page.tsx";
import { EmptyState, Notice, QueryStatus } from "../../components/ui/states.tsx";
import { Button } from "../../components/ui/button.tsx";
import { errorMessage } from "../../lib/api-client.ts";
import { can } from "../../../shared/auth/permissions.ts";
import { DataTable, Row, Cell } from "../../components/ui/table.tsx";

const date = (iso: string) => new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" });

export function MembersPage() {
  const { user, membership } = useSignedIn();
  if (!membership || !can(membership.role, "members.manage")) {
    return <EmptyState title="Only an organisation admin manages members.">Ask your admin to invite people or change roles.</EmptyState>;
  }
  const orgId = membership.organisationId;
  return (
    <>
      <PageHeader
        title="Members"
        lead={`People who work in ${membership.organisationName} on Cellarpact, and the roles that decide what they can do.`}
      />
      <div className="flex flex-col gap-6">
        <Card title="Invite someone">
          <InviteForm orgId={orgId} kind={membership.organisationKind} />
        </Card>
        <MemberTable orgId={orgId} kind={membership.organisationKind} selfId={user.id} />
        <OpenInvitations orgId={orgId} />
      </div>
    </>
  );
}

function MemberTable({ orgId, kind, selfId }: { orgId: number; kind: keyof typeof ROLES_BY_KIND; selfId: number }) {
  const members = useQuery(membersQueryOptions(orgId));
  const changeRole = useChangeRole(orgId);
  const remove = useRemoveMember(orgId);
  const confirm = useConfirm();
  const [error, setError] = useState<string | null>(null);
  const onError = (err: unknown) => setError(errorMessage(err));

  return (
    <Card title="Current members">
      {error && <Notice tone="error">{error}</Notice>}
      <QueryStatus query={members} empty="No members yet." />
      {members.data && members.data.length > 0 && (
        <DataTable
          headings={[
            "Name",
            "E-mail",
            "Role",
            "Member since",
            <>
              <span className="sr-only">Actions</span>
            </>,
          ]}
          className="mt-2"
        >
          {members.data.map((m) => (
            <Row key={m.membershipId}>
              <Cell className="font-semibold">
                {m.name}
                {m.userId === selfId && " (you)"}
              </Cell>
              <Cell>{m.email}</Cell>
              <Cell>
                <label className="sr-only" htmlFor={`role-${m.membershipId}`}>
                  Role of {m.name}
                </label>
                <select
                  id={`role-${m.membershipId}`}
                  className="rounded border border-line bg-white px-2 py-1"
                  value={m.role}
                  disabled={changeRole.isPending}
                  onChange={(e) => {
                    const role = e.target.value as Role;
                    setError(null);
                    confirm.ask({
                      title: `Make ${m.name} ${ROLE_LABELS[role].toLowerCase()}?`,
                      consequence: `${m.name} is signed out everywhere and, at the next sign-in, can do what a ${ROLE_LABELS[role].toLowerCase()} does, and no longer what a ${ROLE_LABELS[m.role].toLowerCase()} does.`,
                      confirmLabel: "Change the role",
                      onConfirm: () => changeRole.mutate({ membershipId: m.membershipId, role }, { onError }),
                    });
                  }}
                >
                  {ROLES_BY_KIND[kind].map((r) => (
                    <option key={r} value={r}>
                      {ROLE_LABELS[r]}
                    </option>
                  ))}
                </select>
              </Cell>
              <Cell>{date(m.since)}</Cell>
              <Cell className="text-right">
                <Button
                  variant="danger"
                  disabled={remove.isPending}
                  onClick={() => {
                    setError(null);
                    confirm.ask({
                      title: `Remove ${m.name} from the organisation?`,
                      consequence: `${m.name} is signed out and loses access to everything the organisation holds. What they did stays in the trail.`,
                      confirmLabel: `Remove ${m.name}`,
                      tone: "danger",
                      onConfirm: () => remove.mutate(m.membershipId, { onError }),
                    });
                  }}
                >
                  Remove
                </Button>
              </Cell>
            </Row>
          ))}
        </DataTable>
      )}
      {confirm.dialog}
    </Card>
  );
}

function OpenInvitations({ orgId }: { orgId: number }) {
  const invitations = useQuery(invitationsQueryOptions(orgId));
  const revoke = useRevokeInvitation(orgId);
  return (
    <Card title="Open invitations">
      <QueryStatus query={invitations} />
      {invitations.data?.length === 0 && (
        <EmptyState title="No open invitations.">Invitations you send appear here until they are accepted.</EmptyState>
      )}
      {invitations.data && invitations.data.length > 0 && (
        <ul className="divide-y divide-line/60">
          {invitations.data.map((inv) => (
            <li key={inv.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-sm">
              <span>
                <strong>{inv.email}</strong> as {ROLE_LABELS[inv.role]} · expires {date(inv.expiresAt)}
              </span>
              <Button variant="secondary" disabled={revoke.isPending} onClick={() => revoke.mutate(inv.id)}>
                Revoke
              </Button>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
