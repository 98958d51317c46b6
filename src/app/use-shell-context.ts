import { useOutletContext } from "react-router-dom";
import type { SessionMembership, SessionUser } from "../features/auth/api/session.ts";

export interface ShellContext {
  user: SessionUser;
  membership: SessionMembership | undefined;
}

export const useShellContext = () => useOutletContext<ShellContext>();
