/**
 * Login throttling per client address; only failed attempts count. Per account, the growing delays
 * of server/services/sign-in-throttle.ts apply instead, which cannot lock the owner out.
 */
import { rateLimit, ipKeyGenerator } from "express-rate-limit";
import type { RequestHandler } from "express";
import { tooManyRequests } from "../errors.ts";

export interface LimitSettings {
  perIp: number;
  windowMinutes: number;
}

export function signInLimiters(s: LimitSettings): RequestHandler[] {
  const windowMs = s.windowMinutes * 60_000;
  const message = `Too many failed sign-in attempts from this address. Wait ${s.windowMinutes} minutes.`;
  const common = {
    windowMs,
    skipSuccessfulRequests: true,
    standardHeaders: "draft-8" as const,
    legacyHeaders: false,
    handler: (_req: unknown, _res: unknown, next: (e: unknown) => void) => next(tooManyRequests(message)),
  };
  return [rateLimit({ ...common, limit: s.perIp, keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? "")}` })];
}

/** Mail-sending public routes (password reset) get a plain per-address limit. */
export function mailLimiter(s: LimitSettings): RequestHandler {
  return rateLimit({
    windowMs: s.windowMinutes * 60_000,
    limit: s.perIp,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    keyGenerator: (req) => `mail:${ipKeyGenerator(req.ip ?? "")}`,
    handler: (_req, _res, next) => next(tooManyRequests("Too many requests from this address. Try again later.")),
  });
}
