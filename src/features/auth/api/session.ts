import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import type { SessionUser } from "../../../../shared/auth/session.ts";

export type { SessionMembership, SessionUser } from "../../../../shared/auth/session.ts";
import type { SignInInput } from "../../../../shared/auth/schemas.ts";

export interface Session {
  user: SessionUser | null;
  csrfToken: string | null;
}

export const sessionQueryOptions = () =>
  queryOptions({ queryKey: ["session"], queryFn: () => api<Session>("/api/auth/session"), staleTime: 60_000 });

export const useSession = () => useQuery(sessionQueryOptions());

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => api<Session>("/api/auth/sign-in", { method: "POST", body: input }),
    onSuccess: (session) => {
      qc.clear();
      qc.setQueryData(sessionQueryOptions().queryKey, session);
    },
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>("/api/auth/sign-out", { method: "POST" }),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(sessionQueryOptions().queryKey, { user: null, csrfToken: null });
    },
  });
}
