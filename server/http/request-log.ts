/**
 * One compact line per request: its id, method, path and status, and nothing a reader of the log
 * could use to act as someone (OWASP Logging Cheat Sheet, "data to exclude"). The one-time tokens
 * that links carry in their paths are replaced, and no header is logged at all — so neither the
 * session cookie, the CSRF token nor an Authorization header reaches the log.
 */
import type { IncomingMessage, ServerResponse } from "node:http";

/** Paths whose last segment is a one-time token (mailed links and the invitation lookup). */
const TOKEN_PATHS = /^(\/(?:reset-password|accept-invitation|api\/invitations)\/)(?!accept(?:$|[/?]))[^/?#]+/;
const TOKEN_QUERY = /([?&](?:token|key|secret|code)=)[^&#]*/gi;

export const redactUrl = (url: string): string => url.replace(TOKEN_PATHS, "$1[token]").replace(TOKEN_QUERY, "$1[redacted]");

export const requestLogSerializers = {
  req: (req: IncomingMessage & { id?: unknown }) => ({ id: req.id, method: req.method, url: redactUrl(req.url ?? "") }),
  res: (res: ServerResponse) => ({ statusCode: res.statusCode }),
};
