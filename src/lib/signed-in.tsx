/**
 * The signed-in user and the organisation the app is showing, for every page under the shell.
 * An organisation's page asks `useOrganisation()`, which guarantees one: pages never fall back to
 * organisation 0 or wait on a flag.
 */
import { createContext, useContext, type ReactNode } from "react";
import type { SessionMembership, SessionUser } from "./session.ts";

interface SignedIn {
  user: SessionUser;
  membership: SessionMembership | undefined;
}

const SignedInContext = createContext<SignedIn | null>(null);

export function SignedInProvider({ value, children }: { value: SignedIn; children: ReactNode }) {
  return <SignedInContext.Provider value={value}>{children}</SignedInContext.Provider>;
}

export function useSignedIn(): SignedIn {
  const v = useContext(SignedInContext);
  if (!v) throw new Error("useSignedIn is used outside the signed-in shell");
  return v;
}

/** Thrown where a page needs an organisation and the user has none; the route's error view explains it. */
export class NoOrganisationError extends Error {
  constructor() {
    super("This page belongs to an organisation, and your account is not a member of one.");
  }
}

export function useOrganisation(): { orgId: number; membership: SessionMembership; user: SessionUser } {
  const { user, membership } = useSignedIn();
  if (!membership) throw new NoOrganisationError();
  return { orgId: membership.organisationId, membership, user };
}
