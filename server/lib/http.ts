import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { z } from 'zod';
import { roleAtLeast, type Role } from '../../shared/contracts/roles.ts';
import type { TokenScope } from '../../shared/contracts/tokens.ts';
import { projectWords } from '../../shared/contracts/field-issues.ts';
import { AppError, badRequest, forbidden, unauthenticated } from './errors.ts';
import type { RequestAuth } from './request-auth.ts';

/**
 * Who may call a route: anyone, any signed-in user (even one without a department), or a
 * member of the caller's active department holding at least the given role.
 */
export type Access = 'public' | 'signedIn' | Role;

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec<B extends z.ZodType | undefined, Q extends z.ZodType | undefined, P extends z.ZodType | undefined> {
  method: Method;
  /** Express path relative to the router's mount point, e.g. "/members/:userId". */
  path: string;
  summary: string;
  tag: string;
  access: Access;
  body?: B;
  query?: Q;
  params?: P;
  /** Schema of a 2xx JSON answer (documents the route; not enforced at run time). */
  response?: z.ZodType;
  /** Status of a successful answer (default 200). */
  status?: number;
  /**
   * What an API token needs to call this route: `read` (the default for GET), `run` (starting
   * and cancelling runs and sweeps) or `never` (the default for every other method: account,
   * member, billing and token management need a signed-in session).
   */
  tokenScope?: TokenScope | 'never';
  /** Extra middleware run after access checks and before validation (e.g. a rate limiter). */
  before?: RequestHandler[];
  /** Non-JSON success bodies, for the API description. */
  produces?: string;
}

type Out<S> = S extends z.ZodType ? z.output<S> : undefined;

export interface RouteInput<B, Q, P> {
  body: Out<B>;
  query: Out<Q>;
  params: Out<P>;
  req: Request;
  res: Response;
}

export interface SignedInInput<B, Q, P> extends RouteInput<B, Q, P> {
  auth: RequestAuth;
}

/** Every route defined through defineRoute, in definition order (read by the API description). */
export interface RegisteredRoute {
  method: Method;
  fullPath: string;
  summary: string;
  tag: string;
  access: Access;
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
  response?: z.ZodType;
  status: number;
  produces?: string;
}

export class RouteRegistry {
  readonly routes: RegisteredRoute[] = [];
}

const FORBIDDEN_KEYS = new Set(['__proto__']);

/**
 * Refuses what no schema should have to think about: a NUL character in any text (it ends
 * strings in C libraries, logs and file names) and keys that reach an object's prototype.
 */
function refuseHostileValues(value: unknown, path: string[] = [], depth = 0): void {
  if (typeof value === 'string') {
    if (value.includes('\u0000')) throw badRequest(`${path.join('.') || 'body'} must not contain a NUL character (\\u0000)`, path.join('.') || undefined);
    return;
  }
  if (!value || typeof value !== 'object' || depth > 64) return;
  for (const key of Object.keys(value)) {
    const field = [...path, key];
    if (FORBIDDEN_KEYS.has(key)) throw badRequest(`${field.join('.')} is not a field this request accepts`, field.join('.'));
    if (key.includes('\u0000')) throw badRequest(`${path.join('.') || 'body'} has a key with a NUL character (\\u0000)`, path.join('.') || undefined);
    refuseHostileValues((value as Record<string, unknown>)[key], field, depth + 1);
  }
}

/**
 * Parses one part of the request with its shared schema, in the project's words (field-issues.ts);
 * a ZodError reaches the error middleware, which answers 400 with every problem.
 */
function parsePart(schema: z.ZodType | undefined, value: unknown, where: 'body' | 'query' | 'params'): unknown {
  // A missing body is validated as undefined ("body is required"); missing params/query as {}.
  if (!schema) return undefined;
  refuseHostileValues(value);
  const input = value ?? (where === 'body' ? undefined : {});
  const result = schema.safeParse(input, { error: projectWords });
  if (result.success) return result.data;
  throw result.error;
}

/** Refuses a token caller whose token's scope does not allow the route. */
function tokenAllows(auth: RequestAuth, needed: TokenScope | 'never'): AppError | null {
  if (!auth.tokenId) return null;
  if (needed === 'never') return forbidden('API tokens cannot do this; sign in to Tidefield to manage your account, members, billing and tokens.');
  if (needed === 'run' && auth.tokenScope !== 'run') return forbidden('This API token has the read scope; starting and cancelling runs and sweeps needs a token with the run scope.');
  return null;
}

export function requireAccess(access: Access, tokenScope: TokenScope | 'never' = 'never'): RequestHandler {
  return (_req, res, next) => {
    if (access === 'public') return next();
    const auth = res.locals.auth;
    if (!auth) return next(unauthenticated());
    const refused = tokenAllows(auth, tokenScope);
    if (refused) return next(refused);
    if (access === 'signedIn') return next();
    if (!auth.department || !auth.role) return next(forbidden('You are not a member of any department yet.'));
    if (!roleAtLeast(auth.role, access)) {
      return next(forbidden(`This needs the ${access} role or higher in ${auth.department.name}; you are ${auth.role}.`));
    }
    next();
  };
}

/**
 * Declares a route: access rule, shared zod schemas for params, query and body, and a handler
 * that receives the parsed values. Handlers only parse, call a service and serialise.
 * A handler's return value is sent as JSON with `spec.status` (undefined → 204 No Content),
 * unless the handler has already answered itself (streams, CSV, redirects).
 */
export function defineRoute<
  B extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  P extends z.ZodType | undefined = undefined,
>(
  router: Router,
  registry: RouteRegistry,
  mountPath: string,
  spec: RouteSpec<B, Q, P>,
  handler: (input: SignedInInput<B, Q, P>) => unknown,
): void {
  registry.routes.push({
    method: spec.method,
    fullPath: mountPath + spec.path,
    summary: spec.summary,
    tag: spec.tag,
    access: spec.access,
    body: spec.body,
    query: spec.query,
    params: spec.params,
    response: spec.response,
    status: spec.status ?? 200,
    produces: spec.produces,
  });
  const run = async (req: Request, res: Response) => {
    const input = {
      params: parsePart(spec.params, req.params, 'params'),
      query: parsePart(spec.query, req.query, 'query'),
      body: parsePart(spec.body, req.body, 'body'),
      req,
      res,
      auth: res.locals.auth as RequestAuth,
    } as SignedInInput<B, Q, P>;
    const result = await handler(input);
    if (res.headersSent) return;
    if (result === undefined) {
      res.status(204).end();
      return;
    }
    // A handler may choose another status itself (health answers 503 with its usual body).
    res.status(res.statusCode !== 200 ? res.statusCode : (spec.status ?? 200)).json(result);
  };
  const tokenScope = spec.tokenScope ?? (spec.method === 'get' ? 'read' : 'never');
  router[spec.method](spec.path, requireAccess(spec.access, tokenScope), ...(spec.before ?? []), run);
}

/** Wraps an error-first callback middleware (e.g. express.json) so its errors become AppErrors. */
export function translateErrors(
  middleware: RequestHandler,
  translate: (error: unknown) => AppError | undefined,
): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) =>
    middleware(req, res, (error?: unknown) => {
      if (!error) return next();
      next(translate(error) ?? error);
    });
}
