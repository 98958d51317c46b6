import type { RouteRegistry } from "../http/route-registry.ts";
import { PUBLIC } from "../http/access.ts";
import { buildOpenApi } from "../http/openapi.ts";
import { databaseHealth } from "../services/health-service.ts";
import { readDevInbox } from "../integrations/mail/dev-inbox.ts";
import { upstreamFailed } from "../errors.ts";

export function registerSystemRoutes(r: RouteRegistry, opts: { version: string; devInboxUrl?: string }): void {
  const routes = r.section("system");
  routes.get(
    "/api/health",
    { summary: "Service and database state", access: PUBLIC, errors: { 503: "database down" } },
    async ({ res }) => {
      const db = await databaseHealth();
      if (db.status !== "up") res.locals.status = 503;
      return { status: db.status === "up" ? "ok" : "degraded", version: opts.version, database: db };
    },
  );

  routes.get("/api/openapi.json", { summary: "This API's OpenAPI 3.1 document", access: PUBLIC }, () =>
    buildOpenApi(r.routes, opts.version),
  );

  if (opts.devInboxUrl) {
    const url = opts.devInboxUrl;
    routes.get(
      "/api/dev/inbox",
      {
        summary: "Mail caught by the local SMTP fake (demo and development only)",
        access: PUBLIC,
        errors: { 502: "the mail fake is not running" },
      },
      async () => {
        try {
          return await readDevInbox(url);
        } catch (err) {
          throw upstreamFailed("Mail fake unavailable", `Could not read the local mail fake: ${(err as Error).message}`);
        }
      },
    );
  }
}
