/** Builds the Express app without listening, so tests can drive it with supertest. */
import express, { type Express } from "express";
import helmet from "helmet";
import compression from "compression";
import cookieParser from "cookie-parser";
import { pinoHttp } from "pino-http";
import { requestLogSerializers } from "./http/request-log.ts";
import { requestBudget } from "./http/request-budget.ts";
import { memoryBudget } from "./http/memory-budget.ts";
import type { Logger } from "pino";
import path from "node:path";
import { randomUUID } from "node:crypto";
import type { Config } from "./config.ts";
import { RouteRegistry } from "./http/route-registry.ts";
import { errorHandler, notFoundHandler } from "./http/error-handler.ts";
import { sessionMiddleware, type CookieSettings } from "./http/session.ts";
import { mailLimiter, signInLimiters } from "./http/rate-limits.ts";
import { registerAuthRoutes } from "./routes/auth-routes.ts";
import { registerOrganisationRoutes } from "./routes/organisation-routes.ts";
import { registerSystemRoutes } from "./routes/system-routes.ts";
import { registerSpecRoutes } from "./routes/spec-routes.ts";
import { registerLotRoutes } from "./routes/lot-routes.ts";
import { registerDeviationRoutes } from "./routes/deviation-routes.ts";
import { registerTrailRoutes } from "./routes/trail-routes.ts";
import { registerComplianceAuditRoutes } from "./routes/compliance-audit-routes.ts";
import { registerPaymentWebhookRoutes, STRIPE_WEBHOOK_PATH } from "./routes/payment-webhook-routes.ts";
import { settingsFrom, useServiceSettings } from "./settings.ts";

export const APP_VERSION = "0.1.0";
export const BODY_LIMIT = "100kb";
/** CSV imports arrive in batches of up to 2,000 samples. */
export const IMPORT_BODY_LIMIT = "8mb";

export function createApp(config: Config, logger: Logger): { app: Express; registry: RouteRegistry } {
  useServiceSettings(settingsFrom(config));
  const production = config.NODE_ENV === "production";
  const cookies: CookieSettings = { secret: config.JWT_SECRET, hours: config.SESSION_HOURS, secure: config.COOKIE_SECURE };
  const limits = {
    perIp: config.LOGIN_LIMIT_PER_IP,
    windowMinutes: config.LOGIN_WINDOW_MINUTES,
  };

  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", "loopback");
  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const incoming = req.headers["x-request-id"];
        const id = typeof incoming === "string" && /^[\w-]{8,64}$/.test(incoming) ? incoming : randomUUID();
        res.setHeader("X-Request-Id", id);
        return id;
      },
      autoLogging: { ignore: (req) => req.url === "/api/health" },
      serializers: requestLogSerializers,
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          "frame-ancestors": ["'none'"],
          "object-src": ["'none'"],
          "img-src": ["'self'", "data:", "blob:"],
          // The demo is served over plain HTTP; only ask browsers to upgrade when cookies are Secure.
          "upgrade-insecure-requests": config.COOKIE_SECURE ? [] : null,
        },
      },
      strictTransportSecurity: production && config.COOKIE_SECURE,
    }),
  );
  // Answers and static files go compressed when the client accepts it (JSON compresses about threefold).
  app.use(compression());
  app.use(cookieParser());
  // Stripe signs the exact bytes it sends, so its webhook gets the raw body, before any JSON parser runs.
  app.use(STRIPE_WEBHOOK_PATH, express.raw({ type: "application/json", limit: "1mb" }));
  app.use(/^\/api\/orgs\/\d+\/contracts\/\d+\/imports$/, express.json({ limit: IMPORT_BODY_LIMIT }));
  app.use("/api", express.json({ limit: BODY_LIMIT }));
  app.use("/api", requestBudget(config.REQUEST_BUDGET_MS));
  app.use("/api", memoryBudget({ heapFraction: config.HEAP_BUDGET_FRACTION, answerBytes: config.ANSWER_BUDGET_BYTES }));
  app.use("/api", sessionMiddleware(cookies));
  app.use("/api/auth/sign-in", ...signInLimiters(limits));
  app.use("/api/auth/password-reset/request", mailLimiter(limits));

  const router = express.Router();
  const registry = new RouteRegistry(router);
  registerSystemRoutes(registry, { version: APP_VERSION });
  registerAuthRoutes(registry, cookies);
  registerOrganisationRoutes(registry);
  registerSpecRoutes(registry);
  registerLotRoutes(registry, { certificateMaxBytes: config.CERTIFICATE_MAX_BYTES });
  registerDeviationRoutes(registry, { attachmentMaxBytes: config.CERTIFICATE_MAX_BYTES });
  registerTrailRoutes(registry);
  registerComplianceAuditRoutes(registry);
  registerPaymentWebhookRoutes(registry);
  app.use(router);
  app.use("/api", notFoundHandler);

  if (config.CLIENT_DIR) {
    const dir = path.resolve(config.CLIENT_DIR);
    // Vite names built assets by their content hash, so a browser may keep them for good; index.html is asked for afresh.
    app.use(
      "/assets",
      express.static(path.join(dir, "assets"), { index: false, immutable: production, maxAge: production ? "365d" : 0 }),
      // A missing asset is a 404, not the single page in its place.
      (_req: express.Request, res: express.Response) => res.status(404).end(),
    );
    app.use(express.static(dir, { index: false, maxAge: 0 }));
    // Any other GET is a client-side route: serve the single page.
    app.get(/.*/, (_req, res) => res.sendFile(path.join(dir, "index.html")));
  }
  app.use(errorHandler(production));
  return { app, registry };
}
