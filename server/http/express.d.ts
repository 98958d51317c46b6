import type { SessionUser } from "../services/session-service.ts";

declare global {
  namespace Express {
    interface Request {
      /** Set by the session middleware; null when the request carries no valid session. */
      user?: SessionUser | null;
      sessionId?: string;
    }
  }
}
export {};
