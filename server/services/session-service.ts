/** Session tokens (JWT in an HttpOnly cookie) and the user loaded for each request. */
import jwt from "jsonwebtoken";
import { createHmac, randomUUID } from "node:crypto";
import type { SessionUser } from "../../shared/auth/session.ts";

export type { SessionMembership, SessionUser } from "../../shared/auth/session.ts";
import { User } from "../models/user.ts";
import { Membership } from "../models/membership.ts";
import { Organisation } from "../models/organisation.ts";

interface TokenClaims {
  sub: string;
  sv: number;
  jti: string;
  iat: number;
  exp: number;
}

export interface SessionSettings {
  secret: string;
  hours: number;
}

export function issueSessionToken(s: SessionSettings, userId: number, sessionVersion: number): { token: string; sessionId: string } {
  const sessionId = randomUUID();
  const token = jwt.sign({ sv: sessionVersion }, s.secret, {
    algorithm: "HS256",
    subject: String(userId),
    jwtid: sessionId,
    expiresIn: Math.round(s.hours * 3600),
  });
  return { token, sessionId };
}

/** The CSRF token is bound to the session id, so a token planted from elsewhere does not match. */
export const csrfTokenFor = (secret: string, sessionId: string) =>
  createHmac("sha256", secret).update(`csrf:${sessionId}`).digest("base64url");

export function readSessionToken(s: SessionSettings, token: string): TokenClaims | null {
  try {
    return jwt.verify(token, s.secret, { algorithms: ["HS256"] }) as TokenClaims;
  } catch {
    return null;
  }
}

/** Loads the user behind valid claims; null when the user is gone or the session was revoked. */
export async function loadSessionUser(claims: TokenClaims): Promise<SessionUser | null> {
  const user = await User.findByPk(Number(claims.sub));
  if (!user || user.sessionVersion !== claims.sv || !user.passwordHash) return null;
  return toSessionUser(user);
}

export async function toSessionUser(user: User): Promise<SessionUser> {
  const memberships = await Membership.findAll({
    where: { userId: user.id },
    include: [{ model: Organisation, as: "organisation" }],
    order: [["id", "ASC"]],
  });
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    isPlatformAdmin: user.isPlatformAdmin,
    memberships: memberships.map((m) => {
      const org = (m as Membership & { organisation: Organisation }).organisation;
      return {
        membershipId: m.id,
        organisationId: m.organisationId,
        organisationName: org.name,
        organisationKind: org.kind,
        role: m.role,
      };
    }),
  };
}
