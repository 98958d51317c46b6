/** Reads the session cookie on every request and enforces CSRF on cookie-authenticated writes. */
import type { RequestHandler, Response } from "express";
import { timingSafeEqual } from "node:crypto";
import { csrfTokenFor, issueSessionToken, loadSessionUser, readSessionToken, type SessionSettings } from "../services/session-service.ts";
import { forbidden } from "../errors.ts";

export const SESSION_COOKIE = "cp_session";
export const CSRF_COOKIE = "cp_csrf";
export const CSRF_HEADER = "x-csrf-token";

export interface CookieSettings extends SessionSettings {
  secure: boolean;
}

export function startSession(res: Response, s: CookieSettings, userId: number, sessionVersion: number): string {
  const { token, sessionId } = issueSessionToken(s, userId, sessionVersion);
  const maxAge = s.hours * 3600 * 1000;
  res.cookie(SESSION_COOKIE, token, { httpOnly: true, sameSite: "lax", secure: s.secure, path: "/", maxAge });
  const csrf = csrfTokenFor(s.secret, sessionId);
  // Readable by the page script, which echoes it in the X-CSRF-Token header.
  res.cookie(CSRF_COOKIE, csrf, { httpOnly: false, sameSite: "strict", secure: s.secure, path: "/", maxAge });
  return csrf;
}

export function endSession(res: Response, s: CookieSettings): void {
  res.clearCookie(SESSION_COOKIE, { path: "/", httpOnly: true, sameSite: "lax", secure: s.secure });
  res.clearCookie(CSRF_COOKIE, { path: "/", sameSite: "strict", secure: s.secure });
}

const UNSAFE = new Set(["POST", "PUT", "PATCH", "DELETE"]);

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

export function sessionMiddleware(s: CookieSettings): RequestHandler {
  return async (req, res, next) => {
    req.user = null;
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof token !== "string") return next();
    const claims = readSessionToken(s, token);
    const user = claims ? await loadSessionUser(claims) : null;
    if (!claims || !user) {
      endSession(res, s);
      return next();
    }
    if (UNSAFE.has(req.method)) {
      const sent = req.get(CSRF_HEADER);
      if (!sent || !sameToken(sent, csrfTokenFor(s.secret, claims.jti))) {
        return next(forbidden("The request lacks a valid CSRF token. Reload the page and try again."));
      }
    }
    req.user = user;
    req.sessionId = claims.jti;
    // Renew a session that is past half its life, so active users are not signed out mid-task.
    const halfLife = (s.hours * 3600) / 2;
    if (Date.now() / 1000 - claims.iat > halfLife && req.method === "GET") startSession(res, s, user.id, claims.sv);
    next();
  };
}
