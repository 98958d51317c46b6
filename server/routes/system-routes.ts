import type { RouteRegistry } from "../http/route-registry.ts";
import { PUBLIC } from "../http/access.ts";
import { buildOpenApi } from "../http/openapi.ts";
import { databaseHealth } from "../services/health-service.ts";

export function registerSystemRoutes(r: RouteRegistry, opts: { version: string }): void {
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
}
