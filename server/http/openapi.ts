/** Builds the OpenAPI 3.1 document from the route declarations, using zod's own JSON Schema output. */
import { z, type ZodType } from "zod";
import { describeAccess } from "./access.ts";
import type { RouteSpec } from "./route-registry.ts";

const jsonSchema = (schema: ZodType) => z.toJSONSchema(schema, { io: "input", unrepresentable: "any", target: "draft-2020-12" });

const toOpenApiPath = (path: string) => path.replace(/:([A-Za-z0-9_]+)/g, "{$1}");

function parameters(spec: RouteSpec) {
  const params: object[] = [];
  for (const match of spec.path.matchAll(/:([A-Za-z0-9_]+)/g)) {
    const name = match[1]!;
    const shape = (spec.params as z.ZodObject | undefined)?.shape?.[name] as ZodType | undefined;
    params.push({ name, in: "path", required: true, schema: shape ? jsonSchema(shape) : { type: "string" } });
  }
  const query = spec.query as z.ZodObject | undefined;
  for (const [name, schema] of Object.entries(query?.shape ?? {})) {
    params.push({ name, in: "query", required: false, schema: jsonSchema(schema as ZodType) });
  }
  return params;
}

const problem = { content: { "application/problem+json": { schema: { $ref: "#/components/schemas/Problem" } } } };

export function buildOpenApi(routes: readonly RouteSpec[], version: string) {
  const paths: Record<string, Record<string, object>> = {};
  for (const spec of routes) {
    const responses: Record<string, object> = {
      [String(spec.status ?? 200)]: { description: "Success", content: { [spec.produces ?? "application/json"]: {} } },
      "400": { description: "Invalid input, with a message per field", ...problem },
    };
    if (spec.access.kind !== "public") {
      responses["401"] = { description: "Not signed in", ...problem };
      responses["403"] = { description: "Signed in but not allowed, or the CSRF token is missing", ...problem };
    }
    if (spec.access.kind === "org-member") responses["404"] = { description: "Not found, or not your organisation's", ...problem };
    for (const [status, description] of Object.entries(spec.errors ?? {})) responses[status] = { description, ...problem };
    (paths[toOpenApiPath(spec.path)] ??= {})[spec.method] = {
      summary: spec.summary,
      tags: [spec.tag],
      "x-access": describeAccess(spec.access),
      security: spec.access.kind === "public" ? [] : [{ sessionCookie: [] }],
      parameters: parameters(spec),
      ...(spec.body ? { requestBody: { required: true, content: { "application/json": { schema: jsonSchema(spec.body) } } } } : {}),
      ...(spec.consumes
        ? {
            requestBody: {
              required: true,
              content: {
                [spec.consumes]: {
                  schema: { type: "object", properties: { file: { type: "string", format: "binary" } }, required: ["file"] },
                },
              },
            },
          }
        : {}),
      responses,
    };
  }
  return {
    openapi: "3.1.0",
    info: {
      title: "Cellarpact API",
      version,
      description: "Every operation states its access rule in x-access. Writes with a session cookie need the X-CSRF-Token header.",
    },
    paths,
    components: {
      securitySchemes: { sessionCookie: { type: "apiKey", in: "cookie", name: "cp_session" } },
      schemas: {
        Problem: {
          type: "object",
          description: "RFC 9457 problem details",
          properties: {
            type: { type: "string" },
            title: { type: "string" },
            status: { type: "integer" },
            detail: { type: "string" },
            instance: { type: "string" },
            requestId: { type: "string" },
            errors: { type: "array", items: { type: "object", properties: { path: { type: "string" }, message: { type: "string" } } } },
          },
        },
      },
    },
  };
}
