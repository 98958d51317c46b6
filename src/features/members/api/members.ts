import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import type { Role } from "../../../../shared/auth/roles.ts";
import type { InvitationView as OpenInvitation, MemberView as Member } from "../../../../shared/auth/views.ts";
import type { InviteInput } from "../../../../shared/auth/schemas.ts";

export const membersQueryOptions = (orgId: number) =>
  queryOptions({ queryKey: ["orgs", orgId, "members"], queryFn: () => api<Member[]>(`/api/orgs/${orgId}/members`) });

export const invitationsQueryOptions = (orgId: number) =>
  queryOptions({ queryKey: ["orgs", orgId, "invitations"], queryFn: () => api<OpenInvitation[]>(`/api/orgs/${orgId}/invitations`) });

function useOrgInvalidation(orgId: number) {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: membersQueryOptions(orgId).queryKey });
    void qc.invalidateQueries({ queryKey: invitationsQueryOptions(orgId).queryKey });
  };
}

export function useInvite(orgId: number) {
  const invalidate = useOrgInvalidation(orgId);
  return useMutation({
    mutationFn: (input: InviteInput) => api<OpenInvitation>(`/api/orgs/${orgId}/invitations`, { method: "POST", body: input }),
    onSuccess: invalidate,
  });
}

export function useRevokeInvitation(orgId: number) {
  const invalidate = useOrgInvalidation(orgId);
  return useMutation({
    mutationFn: (id: number) => api<void>(`/api/orgs/${orgId}/invitations/${id}`, { method: "DELETE" }),
    onSuccess: invalidate,
  });
}

export function useChangeRole(orgId: number) {
  const invalidate = useOrgInvalidation(orgId);
  return useMutation({
    mutationFn: (p: { membershipId: number; role: Role }) =>
      api<Member>(`/api/orgs/${orgId}/members/${p.membershipId}`, { method: "PATCH", body: { role: p.role } }),
    onSuccess: invalidate,
  });
}

export function useRemoveMember(orgId: number) {
  const invalidate = useOrgInvalidation(orgId);
  return useMutation({
    mutationFn: (membershipId: number) => api<void>(`/api/orgs/${orgId}/members/${membershipId}`, { method: "DELETE" }),
    onSuccess: invalidate,
  });
}
