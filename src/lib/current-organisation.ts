/** Which of the user's organisations the app is showing; remembered per browser. */
import { useCallback, useSyncExternalStore } from "react";
import type { SessionMembership, SessionUser } from "./session.ts";

const KEY = "cellarpact.organisation";
const listeners = new Set<() => void>();

function read(): number | null {
  const v = Number(localStorage.getItem(KEY));
  return Number.isInteger(v) && v > 0 ? v : null;
}

export function useCurrentMembership(user: SessionUser | null | undefined): {
  membership: SessionMembership | undefined;
  choose: (organisationId: number) => void;
} {
  const chosen = useSyncExternalStore(
    (cb) => {
      listeners.add(cb);
      return () => listeners.delete(cb);
    },
    read,
    () => null,
  );
  const membership = user?.memberships.find((m) => m.organisationId === chosen) ?? user?.memberships[0];
  const choose = useCallback((organisationId: number) => {
    localStorage.setItem(KEY, String(organisationId));
    listeners.forEach((l) => l());
  }, []);
  return { membership, choose };
}
