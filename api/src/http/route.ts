import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { z } from 'zod';
import type { Role } from '../contracts/roles.js';
import { ROLE_LABELS } from '../contracts/roles.js';
import type { IngestPrincipal } from '../auth/ingest-principal.js';
import type { SignedInUser } from '../auth/user.js';
import { AppError, badRequest, forbidden, unauthenticated } from './errors.js';

export type Access = 'public' | 'signed-in' | readonly Role[];
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec<B extends z.ZodType | undefined, Q extends z.ZodType | undefined> {
  method: Method;
  /** Express-style path, e.g. /api/v1/users/:id/roles. */
  path: string;
  access: Access;
  summary: string;
  tag: string;
  body?: B;
  /**
   * For documentation: the route also takes multipart/form-data with these text fields, sent
   * before the file part named `file` (the handler reads the stream itself).
   */
  multipart?: { fields: z.ZodType; file: string };
  query?: Q;
  response?: z.ZodType;
  status?: number;
  /** An ingest source's token may call this route too, for the loops (:loopId) it is scoped to. */
  ingest?: boolean;
  /** Middleware run before the access check (e.g. a rate limit). */
  use?: RequestHandler[];
}

type Parsed<S> = S extends z.ZodType ? z.infer<S> : undefined;

export interface RouteContext<B, Q> {
  req: Request;
  res: Response;
  body: B;
  query: Q;
  user: SignedInUser;
  /** Set instead of user when an ingest source's token made the request. */
  ingest?: IngestPrincipal;
}

export type CsrfCheck = (req: Request) => boolean;
type AnySpec = RouteSpec<z.ZodType | undefined, z.ZodType | undefined>;

const UNSAFE = new Set(['post', 'put', 'patch', 'delete']);

function checkAccess(access: Access, user: SignedInUser | undefined): void {
  if (access === 'public') return;
  if (!user) throw unauthenticated();
  if (access === 'signed-in') return;
  if (!access.some((role) => user.roles.includes(role))) {
    const needed = access.map((r) => ROLE_LABELS[r]).join(' or ');
    throw forbidden(`This needs the ${needed} role.`);
  }
}

/** An ingest principal may call only the routes marked ingest, and only for its own loops. */
async function checkIngestAccess(spec: AnySpec, req: Request, principal: IngestPrincipal): Promise<void> {
  if (!spec.ingest)
    throw forbidden('An ingest token may only post readings; use a personal access token for anything else.');
  const loopId = req.params.loopId;
  if (typeof loopId !== 'string' || !(await principal.mayPost(loopId))) {
    throw forbidden(
      `Ingest source "${principal.name}" is not allowed to post readings for this loop; an administrator can add the loop to it.`,
    );
  }
}

function parse<S extends z.ZodType | undefined>(schema: S, value: unknown, where: string): Parsed<S> {
  if (!schema) return undefined as Parsed<S>;
  const result = schema.safeParse(value);
  if (!result.success) {
    const details = result.error.issues.map((i) => ({ path: [where, ...i.path].join('.'), message: i.message }));
    throw badRequest(`The ${where} is not valid: ${details.map((d) => `${d.path}: ${d.message}`).join('; ')}`, details);
  }
  return result.data as Parsed<S>;
}

/**
 * Every API route is declared here with the roles it needs, so the guard, the CSRF check,
 * body validation and the OpenAPI document all come from one declaration.
 */
export function createRouteTable(csrfValid: CsrfCheck) {
  const router = Router();
  const specs: AnySpec[] = [];

  function add<B extends z.ZodType | undefined = undefined, Q extends z.ZodType | undefined = undefined>(
    spec: RouteSpec<B, Q>,
    handler: (ctx: RouteContext<Parsed<B>, Parsed<Q>>) => Promise<unknown> | unknown,
  ): void {
    specs.push(spec as AnySpec);
    router[spec.method](spec.path, ...(spec.use ?? []), async (req: Request, res: Response) => {
      if (req.ingest && spec.access !== 'public') await checkIngestAccess(spec as AnySpec, req, req.ingest);
      else checkAccess(spec.access, req.user);
      if (UNSAFE.has(spec.method) && req.authMethod === 'session' && !csrfValid(req)) {
        throw new AppError(
          403,
          'csrf_invalid',
          'Missing or invalid CSRF token: send the x-csrf-token header from GET /api/v1/csrf-token.',
        );
      }
      const body = parse(spec.body, req.body, 'body') as Parsed<B>;
      const query = parse(spec.query, req.query, 'query') as Parsed<Q>;
      const result = await handler({ req, res, body, query, user: req.user as SignedInUser, ingest: req.ingest });
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      else res.status(spec.status ?? 200).json(result);
    });
  }

  return { router, add, specs: () => specs as readonly AnySpec[] };
}

export type RouteTable = ReturnType<typeof createRouteTable>;
