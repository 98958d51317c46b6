/**
 * Every API route is declared here with its access rule and zod schemas. The same declaration
 * registers the Express handler, validates input and feeds the OpenAPI document.
 */
import type { Request, RequestHandler, Response, Router } from "express";
import type { ZodType } from "zod";
import { enforceAccess, type Access } from "./access.ts";
import { parseOrThrow } from "./validate.ts";
import { idParam } from "../../shared/ids.ts";
import type { SessionMembership, SessionUser } from "../services/session-service.ts";

type Method = "get" | "post" | "put" | "patch" | "delete";

export interface RouteSpec<B = unknown, Q = unknown, P = unknown> {
  method: Method;
  path: string;
  summary: string;
  tag: string;
  access: Access;
  body?: ZodType<B>;
  query?: ZodType<Q>;
  params?: ZodType<P>;
  /** Status sent when the handler returns a value; 200 by default. */
  status?: number;
  /** Status codes other than success and the generic ones, with what they mean. */
  errors?: Record<number, string>;
  /** Response media type when it is not JSON. */
  produces?: string;
  /** Request media type when it is not JSON (uploads). */
  consumes?: string;
  /** Runs after the access check and before validation, e.g. an upload parser, so strangers cannot make the server read a file. */
  before?: RequestHandler;
}

export interface RouteContext<B, Q, P> {
  req: Request;
  res: Response;
  body: B;
  query: Q;
  params: P;
  user: SessionUser | null;
  membership: SessionMembership | undefined;
}

export interface SignedInContext<B, Q, P> extends RouteContext<B, Q, P> {
  user: SessionUser;
}

/** A route's declaration without its method, path and tag, which the section's verb methods supply. */
export type RouteOptions<B, Q, P> = Omit<RouteSpec<B, Q, P>, "method" | "path" | "tag">;
type Handler<B, Q, P> = (ctx: SignedInContext<B, Q, P>) => Promise<unknown> | unknown;

/** Routes under one OpenAPI tag, declared as `section.post(path, options, handler)`. */
export class RouteSection {
  constructor(
    private readonly registry: RouteRegistry,
    private readonly tag: string,
  ) {}

  get<B = undefined, Q = undefined, P = undefined>(path: string, options: RouteOptions<B, Q, P>, handler: Handler<B, Q, P>) {
    this.registry.add({ method: "get", path, tag: this.tag, ...options }, handler);
  }
  post<B = undefined, Q = undefined, P = undefined>(path: string, options: RouteOptions<B, Q, P>, handler: Handler<B, Q, P>) {
    this.registry.add({ method: "post", path, tag: this.tag, ...options }, handler);
  }
  put<B = undefined, Q = undefined, P = undefined>(path: string, options: RouteOptions<B, Q, P>, handler: Handler<B, Q, P>) {
    this.registry.add({ method: "put", path, tag: this.tag, ...options }, handler);
  }
  patch<B = undefined, Q = undefined, P = undefined>(path: string, options: RouteOptions<B, Q, P>, handler: Handler<B, Q, P>) {
    this.registry.add({ method: "patch", path, tag: this.tag, ...options }, handler);
  }
  delete<B = undefined, Q = undefined, P = undefined>(path: string, options: RouteOptions<B, Q, P>, handler: Handler<B, Q, P>) {
    this.registry.add({ method: "delete", path, tag: this.tag, ...options }, handler);
  }
}

export class RouteRegistry {
  readonly routes: RouteSpec[] = [];

  constructor(private readonly router: Router) {}

  section(tag: string): RouteSection {
    return new RouteSection(this, tag);
  }

  add<B = undefined, Q = undefined, P = undefined>(spec: RouteSpec<B, Q, P>, handler: Handler<B, Q, P>): void {
    if (this.routes.some((r) => r.method === spec.method && r.path === spec.path)) {
      throw new Error(`route declared twice: ${spec.method} ${spec.path}`);
    }
    this.routes.push(spec as RouteSpec);
    this.router[spec.method](spec.path, async (req: Request, res: Response) => {
      const orgId = req.params.orgId === undefined ? undefined : parseOrThrow(idParam, req.params.orgId, "params");
      const membership = enforceAccess(spec.access, req.user ?? null, orgId);
      if (spec.before)
        await new Promise<void>((resolve, reject) => spec.before!(req, res, (err?: unknown) => (err ? reject(err) : resolve())));
      const ctx = {
        req,
        res,
        body: spec.body ? parseOrThrow(spec.body, req.body, "body") : (undefined as B),
        query: spec.query ? parseOrThrow(spec.query, req.query, "query") : (undefined as Q),
        params: spec.params ? parseOrThrow(spec.params, req.params, "params") : (undefined as P),
        // Public routes may run without a user; the handler of a non-public route always has one.
        user: req.user as SessionUser,
        membership,
      };
      const result = await handler(ctx);
      if (res.headersSent) return;
      // A handler that needs another success status (a replay, a degraded health check) sets res.locals.status.
      const status = (res.locals.status as number | undefined) ?? spec.status;
      if (result === undefined) res.status(status ?? 204).end();
      else res.status(status ?? 200).json(result);
    });
  }
}
