/** Who is signed in: the session query every part of the app reads. */
import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "./api-client.ts";
import type { SessionUser } from "../../shared/auth/session.ts";

export type { SessionMembership, SessionUser } from "../../shared/auth/session.ts";

export interface Session {
  user: SessionUser | null;
  csrfToken: string | null;
}

export const sessionQueryOptions = () =>
  queryOptions({ queryKey: ["session"], queryFn: () => api<Session>("/api/auth/session"), staleTime: 60_000 });

export const useSession = () => useQuery(sessionQueryOptions());
