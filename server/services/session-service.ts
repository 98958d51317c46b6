/** Session tokens (JWT in an HttpOnly cookie) and the user loaded for each request. */
import jwt from "jsonwebtoken";
import { createHmac, createSecretKey, randomUUID, type KeyObject } from "node:crypto";
import type { SessionUser } from "../../shared/auth/session.ts";

export type { SessionMembership, SessionUser } from "../../shared/auth/session.ts";
import { QueryTypes } from "sequelize";
import { database } from "../db/database.ts";
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

// A string secret makes jsonwebtoken try it as a PEM public key on every call; a secret KeyObject goes straight to HMAC.
const keys = new Map<string, KeyObject>();
function keyOf(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) keys.set(secret, (key = createSecretKey(Buffer.from(secret, "utf8"))));
  return key;
}

export function issueSessionToken(s: SessionSettings, userId: number, sessionVersion: number): { token: string; sessionId: string } {
  const sessionId = randomUUID();
  const token = jwt.sign({ sv: sessionVersion }, keyOf(s.secret), {
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
    return jwt.verify(token, keyOf(s.secret), { algorithms: ["HS256"] }) as TokenClaims;
  } catch {
    return null;
  }
}

interface SessionRow {
  id: number;
  email: string;
  name: string;
  is_platform_admin: number | boolean;
  session_version: number;
  has_password: number;
  membership_id: number | null;
  organisation_id: number;
  organisation_name: string;
  organisation_kind: SessionUser["memberships"][number]["organisationKind"];
  role: SessionUser["memberships"][number]["role"];
}

/**
 * Loads the user behind valid claims, with their memberships, in one hand-written query (every
 * signed-in request runs it); null when the user is gone or the session was revoked.
 */
export async function loadSessionUser(claims: TokenClaims): Promise<SessionUser | null> {
  const rows = await database().query<SessionRow>(
    `SELECT u.id, u.email, u.name, u.is_platform_admin, u.session_version, u.password_hash IS NOT NULL AS has_password,
            m.id AS membership_id, m.organisation_id, m.role, o.name AS organisation_name, o.kind AS organisation_kind
       FROM users u
       LEFT JOIN memberships m ON m.user_id = u.id
       LEFT JOIN organisations o ON o.id = m.organisation_id
      WHERE u.id = :id
      ORDER BY m.id`,
    { replacements: { id: Number(claims.sub) }, type: QueryTypes.SELECT },
  );
  const user = rows[0];
  if (!user || user.session_version !== claims.sv || !user.has_password) return null;
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    isPlatformAdmin: Boolean(user.is_platform_admin),
    memberships: rows
      .filter((m) => m.membership_id !== null)
      .map((m) => ({
        membershipId: m.membership_id!,
        organisationId: m.organisation_id,
        organisationName: m.organisation_name,
        organisationKind: m.organisation_kind,
        role: m.role,
      })),
  };
}

const membershipsInclude = [{ model: Membership, as: "memberships", include: [{ model: Organisation, as: "organisation" }] }];
type UserWithMemberships = User & { memberships: (Membership & { organisation: Organisation })[] };

export async function toSessionUser(user: User): Promise<SessionUser> {
  return sessionUserOf((await User.findByPk(user.id, { include: membershipsInclude })) as UserWithMemberships);
}

function sessionUserOf(user: UserWithMemberships): SessionUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    isPlatformAdmin: user.isPlatformAdmin,
    memberships: [...user.memberships]
      .sort((a, b) => a.id - b.id)
      .map((m) => ({
        membershipId: m.id,
        organisationId: m.organisationId,
        organisationName: m.organisation.name,
        organisationKind: m.organisation.kind,
        role: m.role,
      })),
  };
}
