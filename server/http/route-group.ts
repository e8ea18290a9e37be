// The one way to declare an API route. A route group is one resource's router plus the record of every route on it:
// method, path, who may call it, and the zod schemas of its params, query, body and answer. The schemas type the
// handler's input (no casts of req.params, req.query or req.body) and the records feed the route registry
// (route-registry.ts), from which API documentation can be generated.
//
//   routes.post("/:modelId/revisions", {
//     summary: "Add a revision from rule text",
//     access: project("model:write"),
//     params: ModelParams,
//     body: NewRevisionBody,
//     response: ModelDetail,
//     status: 201,
//     handler: ({ params, body, project, user }) => reviseModel(db, { ... }),
//   });
//
// A handler reads as a checklist: the access check has run (401/403/404 before anything else), params, query and
// body are parsed (400 INVALID_INPUT with the failing fields otherwise), it does the work and returns the `data` of
// the answer, which the group sends as { data } with the route's status. Handlers that answer with a file write it
// to `res` themselves (declare `produces`), and 204 routes return nothing.
import { Router, type Request, type RequestHandler, type Response } from "express";
import type { Knex } from "knex";
import { z } from "zod";
import type { TokenScope } from "@shared/schemas/access-tokens";
import type { Capability } from "@shared/types/roles";
import { projectAccess, requireSiteAdmin, requireUser, type AuthUser, type ProjectContext } from "./auth";
import { HttpError } from "./errors";
import { issueSentence } from "@shared/schemas/issue-words";

export type HttpMethod = "get" | "post" | "put" | "patch" | "delete";
/** Statuses a route answers with when it has done its job (503: a health check that answers, degraded). */
export type AnswerStatus = 200 | 201 | 202 | 204 | 503;

/** Who may call a route: anyone, any signed-in user, site administrators, or project members with a capability. */
export type RouteAccess =
  | { readonly kind: "public" }
  | { readonly kind: "user" }
  | { readonly kind: "site-admin" }
  | { readonly kind: "project"; readonly capability: Capability };

export const anyone = { kind: "public" } as const;
export const signedIn = { kind: "user" } as const;
export const siteAdmin = { kind: "site-admin" } as const;
export const project = <C extends Capability>(capability: C) => ({ kind: "project", capability }) as const;

type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

export interface RouteInput<P, Q, B, A extends RouteAccess> {
  params: Parsed<P>;
  query: Parsed<Q>;
  body: Parsed<B>;
  /** The caller; on public routes only when signed in. */
  user: A extends { kind: "public" } ? AuthUser | undefined : AuthUser;
  /** The project of a project route, with the caller's role in it. */
  project: A extends { kind: "project" } ? ProjectContext : undefined;
  req: Request;
  res: Response;
}

/** A JSON answer whose status is decided while handling, e.g. 201 for a new result and 200 for a reused one. */
export class Reply<T> {
  constructor(
    readonly status: AnswerStatus,
    readonly data: T,
  ) {}
}
export const reply = <T>(status: AnswerStatus, data: T): Reply<T> => new Reply(status, data);

/** What a handler returns: the answer's data when the route declares a response schema, else nothing. */
type Answer<R> = R extends z.ZodType ? z.input<R> | Reply<z.input<R>> : void;

export interface RouteSpec<P, Q, B, R, A extends RouteAccess> {
  /** One line for people (and the generated API documentation). */
  summary: string;
  access: A;
  /** Required when the full path has parameters; its keys must be exactly those parameters. */
  params?: P;
  query?: Q;
  body?: B;
  /** Schema of the `data` the route answers with (JSON routes). */
  response?: R;
  /** Status of the answer; a list when the handler picks one with reply() (the first is the default). */
  status?: AnswerStatus | readonly AnswerStatus[];
  /** Media type of an answer the handler writes to `res` itself (downloads). */
  produces?: string;
  /** Form fields carrying files: the body is multipart/form-data, parsed by a `before` middleware. */
  files?: readonly string[];
  /** Middleware run after the access check and before validation (form parsing, rate limits). */
  before?: readonly RequestHandler[];
  /** false: only a browser session may call this route, never an access token (e.g. managing tokens). */
  tokens?: false;
  handler(input: RouteInput<P, Q, B, A>): Answer<R> | Promise<Answer<R>>;
}

/** The record of one declared route, as the registry keeps it. */
export interface RouteRecord {
  method: HttpMethod;
  /** Path inside the group, Express syntax ("/:modelId/revisions"). */
  path: string;
  summary: string;
  access: RouteAccess;
  params?: z.ZodObject;
  query?: z.ZodType;
  body?: z.ZodType;
  response?: z.ZodType;
  statuses: readonly AnswerStatus[];
  produces?: string;
  files?: readonly string[];
  /** The access-token scope the route needs, or null when tokens are refused. */
  tokenScope: TokenScope | null;
}

/**
 * Reading is what a read token may do: project routes that need only project:read (including POSTs that compute an
 * answer and store nothing) and GETs elsewhere. Site-admin routes and routes that opt out never take tokens.
 */
function tokenScopeOf(method: HttpMethod, access: RouteAccess, tokens: false | undefined): TokenScope | null {
  if (tokens === false || access.kind === "site-admin") return null;
  if (access.kind === "project") return access.capability === "project:read" ? "read" : "write";
  return method === "get" ? "read" : "write";
}

function tokenCheck(scope: TokenScope | null): RequestHandler {
  return (req, _res, next) => {
    const token = req.accessToken;
    if (!token || scope === "read" || (scope === "write" && token.scope === "write")) return next();
    const message =
      scope === null
        ? "This action is open to a browser session only, not to access tokens"
        : "This access token may only read; create a token with the write scope for this";
    next(new HttpError(403, "TOKEN_NOT_ALLOWED", message));
  };
}

type Part = "params" | "query" | "body";

/** Parses one part of the request; the failing fields are named as `part.path` (body.name, query.limit). */
function parsePart(part: Part, schema: z.ZodType | undefined, value: unknown): unknown {
  if (!schema) return undefined;
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const details = result.error.issues.map((i) => ({ field: [part, ...i.path].join("."), message: issueSentence(i) }));
  const first = details[0]!;
  throw new HttpError(400, "INVALID_INPUT", `${first.field}: ${first.message}`, details);
}

export const pathParameters = (path: string): string[] => [...path.matchAll(/:([A-Za-z0-9_]+)/g)].map((m) => m[1]!);

export interface RouteGroupOptions {
  /** Where the group is mounted under /api, Express syntax ("/projects/:projectId/models"). */
  mountPath: string;
  /** The resource's name, used to group routes in documentation. */
  tag: string;
  /** Project routes look the project and the caller's role up here. */
  db: Knex;
}

export class RouteGroup {
  readonly router = Router({ mergeParams: true });
  readonly routes: RouteRecord[] = [];

  constructor(readonly options: RouteGroupOptions) {}

  get mountPath(): string {
    return this.options.mountPath;
  }

  get tag(): string {
    return this.options.tag;
  }

  get<P = undefined, Q = undefined, B = undefined, R = undefined, A extends RouteAccess = RouteAccess>(
    path: string,
    spec: RouteSpec<P, Q, B, R, A>,
  ): void {
    this.add("get", path, spec);
  }

  post<P = undefined, Q = undefined, B = undefined, R = undefined, A extends RouteAccess = RouteAccess>(
    path: string,
    spec: RouteSpec<P, Q, B, R, A>,
  ): void {
    this.add("post", path, spec);
  }

  put<P = undefined, Q = undefined, B = undefined, R = undefined, A extends RouteAccess = RouteAccess>(
    path: string,
    spec: RouteSpec<P, Q, B, R, A>,
  ): void {
    this.add("put", path, spec);
  }

  patch<P = undefined, Q = undefined, B = undefined, R = undefined, A extends RouteAccess = RouteAccess>(
    path: string,
    spec: RouteSpec<P, Q, B, R, A>,
  ): void {
    this.add("patch", path, spec);
  }

  delete<P = undefined, Q = undefined, B = undefined, R = undefined, A extends RouteAccess = RouteAccess>(
    path: string,
    spec: RouteSpec<P, Q, B, R, A>,
  ): void {
    this.add("delete", path, spec);
  }

  private add<P, Q, B, R, A extends RouteAccess>(method: HttpMethod, path: string, spec: RouteSpec<P, Q, B, R, A>) {
    const where = `${method.toUpperCase()} ${this.mountPath}${path}`;
    const params = spec.params as z.ZodType | undefined;
    const record: RouteRecord = {
      method,
      path,
      summary: spec.summary,
      access: spec.access,
      params: this.checkedParams(where, this.mountPath + path, params),
      query: spec.query as z.ZodType | undefined,
      body: spec.body as z.ZodType | undefined,
      response: spec.response as z.ZodType | undefined,
      statuses: typeof spec.status === "number" ? [spec.status] : (spec.status ?? [200]),
      produces: spec.produces,
      files: spec.files,
      tokenScope: tokenScopeOf(method, spec.access, spec.tokens),
    };
    this.routes.push(record);
    const [status] = record.statuses as [AnswerStatus];
    const handle: RequestHandler = async (req, res) => {
      const input = {
        params: parsePart("params", record.params, req.params),
        query: parsePart("query", record.query, req.query),
        body: parsePart("body", record.body, req.body),
        user: req.user,
        project: req.project,
        req,
        res,
      } as RouteInput<P, Q, B, A>;
      const answer: unknown = await spec.handler(input);
      if (record.produces || res.headersSent) return;
      if (answer instanceof Reply) {
        if (!record.statuses.includes(answer.status))
          throw new Error(`${where} answered ${answer.status}, which its declared statuses do not include`);
        res.status(answer.status).json({ data: answer.data });
      } else if (status === 204) res.status(204).end();
      else res.status(status).json({ data: answer });
    };
    this.router[method](
      path,
      tokenCheck(record.tokenScope),
      ...this.accessCheck(spec.access),
      ...(spec.before ?? []),
      handle,
    );
  }

  private accessCheck(access: RouteAccess): RequestHandler[] {
    switch (access.kind) {
      case "public":
        return [];
      case "user":
        return [requireUser];
      case "site-admin":
        return [requireSiteAdmin];
      case "project":
        return [projectAccess(this.options.db, access.capability)];
    }
  }

  /** A documented route names every path parameter in its params schema, and nothing else. */
  private checkedParams(where: string, fullPath: string, params: z.ZodType | undefined): z.ZodObject | undefined {
    const expected = pathParameters(fullPath);
    if (!params) {
      if (expected.length) throw new Error(`${where}: declare a params schema for ${expected.join(", ")}`);
      return undefined;
    }
    if (!(params instanceof z.ZodObject)) throw new Error(`${where}: the params schema must be a z.object`);
    const keys = Object.keys(params.shape).sort();
    if (keys.join(",") !== [...expected].sort().join(","))
      throw new Error(`${where}: params schema has ${keys.join(", ")} but the path has ${expected.join(", ")}`);
    return params;
  }
}

export function routeGroup(options: RouteGroupOptions): RouteGroup {
  return new RouteGroup(options);
}
