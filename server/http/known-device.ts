/**
 * The browser that signed in to an account before keeps a cookie that says so, signed for that
 * account alone (HMAC over its id and the e-mail address), so a cookie earned on one's own account
 * vouches for nothing on another. Sent only to the sign-in route.
 */
import type { Request, Response } from "express";
import { createHmac, randomUUID, timingSafeEqual } from "node:crypto";
import type { CookieSettings } from "./session.ts";

export const DEVICE_COOKIE = "cp_device";
const PATH = "/api/auth/sign-in";
const YEAR_MS = 365 * 24 * 3600 * 1000;

const mac = (secret: string, id: string, email: string) => createHmac("sha256", secret).update(`device:${id}:${email}`).digest("base64url");

/** The device id when the request's cookie was issued for this address; otherwise null. */
export function knownDevice(req: Request, secret: string, email: string): string | null {
  const value: unknown = req.cookies?.[DEVICE_COOKIE];
  if (typeof value !== "string") return null;
  const [id, given] = value.split(".");
  if (!id || !given || !/^[0-9a-f-]{36}$/.test(id)) return null;
  const expected = Buffer.from(mac(secret, id, email));
  const actual = Buffer.from(given);
  return expected.length === actual.length && timingSafeEqual(expected, actual) ? id : null;
}

export function rememberDevice(res: Response, s: CookieSettings, email: string, id: string | null): void {
  const device = id ?? randomUUID();
  res.cookie(DEVICE_COOKIE, `${device}.${mac(s.secret, device, email)}`, {
    httpOnly: true,
    sameSite: "strict",
    secure: s.secure,
    path: PATH,
    maxAge: YEAR_MS,
  });
}
