/** Signing in and out; the session itself is read through src/lib/session.ts. */
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client.ts";
import { sessionQueryOptions, type Session } from "../../../lib/session.ts";
import type { SignInInput } from "../../../../shared/auth/schemas.ts";

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
