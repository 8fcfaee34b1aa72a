import type { EntityManager } from '@mikro-orm/postgresql';
import { RequestContext } from '@mikro-orm/core';
import express, { type Request, type RequestHandler, type Response, type Router } from 'express';
import type { z, ZodType } from 'zod';
import { JOB_EDITOR_ROLES, OFFICE_ROLES, OWNER_ROLES, STAFF_ROLES, type Role } from '@contract';
import { AppError, ForbiddenError, NotFoundError, UnauthenticatedError, UnsupportedMediaTypeError } from './errors';
import { parseInput, zodToFieldErrors } from './validate';
import { ifMatchVersion, setEtag } from './version-lock';
import type { Services } from '../services/services';

/** The signed-in person as every service sees them: the tenant comes from here, never from the request. */
export interface Actor {
  userId: string;
  companyId: string;
  role: Role;
  name: string;
  email: string;
  /** The device label the request came with (`X-Gaugeline-Device`, checked by deviceGuard), kept with what it changes. */
  device?: string;
}

/**
 * What a proposal link gives a customer's browser: a session that reaches only that one proposal's
 * routes. Set in the session by the route that opens a link (modules/proposal-links, GET /api/links/open).
 */
export interface LinkGrant {
  proposalId: string;
  companyId: string;
  /** Epoch ms after which the grant no longer counts. */
  expiresAt: number;
  /** The link it was opened with (its routes check it still works: not revoked, expired or superseded). */
  linkId?: string;
  /** The version that link sent. */
  versionId?: string;
  /** Set once the customer's page has been read in this session (one 'viewed' event per opening). */
  viewed?: boolean;
}

/** Deny by default: every route states who may call it. */
export interface PublicPolicy {
  kind: 'public';
}
export interface RolesPolicy {
  kind: 'roles';
  roles: readonly Role[];
}
/** A customer's proposal-link session, and only for the proposal named by the path parameter `param`. */
export interface LinkPolicy {
  kind: 'link';
  param: string;
}
/** A signed webhook: no session, no CSRF; `verify` checks the signature over the raw body (401 if it fails). */
export interface SignedPolicy {
  kind: 'signed';
  verify: (rawBody: Buffer, req: Request) => boolean | Promise<boolean>;
}
export type Policy = PublicPolicy | RolesPolicy | LinkPolicy | SignedPolicy;
export const PUBLIC: PublicPolicy = { kind: 'public' };
export const roles = (...r: Role[]): RolesPolicy => ({ kind: 'roles', roles: r });
export const link = (param = 'proposalId'): LinkPolicy => ({ kind: 'link', param });
export const signed = (verify: SignedPolicy['verify']): SignedPolicy => ({ kind: 'signed', verify });
export const ANY_STAFF = roles(...STAFF_ROLES);
/** The contract's role groups as policies. */
export const JOB_EDITORS = roles(...JOB_EDITOR_ROLES);
export const OFFICE = roles(...OFFICE_ROLES);
export const OWNER = roles(...OWNER_ROLES);

/** The answer has no body: 204. */
export interface NoContent {
  kind: 'no-content';
}
export const NO_CONTENT: NoContent = { kind: 'no-content' };
/** The handler writes the answer itself (a file, CSV): the declaration names its content type for the docs. */
export interface RawResponse {
  kind: 'raw';
  contentType: string;
}
export const rawResponse = (contentType: string): RawResponse => ({ kind: 'raw', contentType });
export type ResponseSpec = ZodType | NoContent | RawResponse;

/** A JSON answer with a status other than the route's own (e.g. health's 503 with the same body shape). */
export class Reply<T> {
  constructor(
    readonly status: number,
    readonly body: T,
  ) {}
}
export const reply = <T>(status: number, body: T): Reply<T> => new Reply(status, body);

/**
 * A JSON answer already written out: the UTF-8 bytes of exactly `JSON.stringify` of a value of the route's
 * schema, sent with the headers `res.json` would send. For a hot route that keeps the text of what did not
 * change (GET …/desk: issue 13); checked like any other answer where RESPONSE_VALIDATION is on.
 */
export class JsonBytes<T> {
  declare readonly of?: T;
  constructor(readonly bytes: Buffer) {}
}

type Out<RS> = RS extends ZodType ? z.input<RS> : RS extends NoContent ? void : undefined;
/** A handler may answer with readonly arrays (calc's results are readonly); the JSON is the same. */
type DeepReadonly<T> = T extends readonly (infer U)[]
  ? readonly DeepReadonly<U>[]
  : T extends object
    ? { readonly [K in keyof T]: DeepReadonly<T[K]> }
    : T;
type ActorOf<Pol> = [Pol] extends [RolesPolicy] ? Actor : Actor | null;

export interface RouteContext<P, Q, B, A> {
  req: Request;
  res: Response;
  params: P;
  query: Q;
  body: B;
  actor: A;
  em: EntityManager;
  services: Services;
  /** The version the person edited (If-Match), on `versioned` routes that take it (`readsIfMatch`). */
  ifMatch: number;
  /** The grant of a `link` route's session. */
  link: LinkGrant | null;
  /** The body as received, on `raw` (webhook) routes. */
  rawBody: Buffer;
  /** What services take first (lib/service-context.ts): the EntityManager, the actor and the clock. */
  service: { em: EntityManager; actor: A; clock: Services['clock'] };
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec<
  PS extends ZodType,
  QS extends ZodType,
  BS extends ZodType,
  Pol extends Policy,
  RS extends ResponseSpec,
> {
  method: Method;
  path: string;
  policy: Pol;
  /** One line for the API document. */
  summary?: string;
  params?: PS;
  query?: QS;
  body?: BS;
  /** The answer: a zod schema (JSON), NO_CONTENT (204) or rawResponse(type) (the handler writes it). */
  response: RS;
  /** 200 unless said (201 for creates, 202 for accepted work). */
  status?: 200 | 201 | 202;
  /**
   * Optimistic locking: writes to an existing record — PUT, PATCH, DELETE, and a POST action such as
   * "review this option" (any POST but a 201 create) — require `If-Match: "N"` (428 without, 400
   * malformed), given to the handler as `ctx.ifMatch`; a function reads the record's version from the
   * answer for `ETag: "N"` (all a create does with it).
   */
  versioned?: true | ((out: Out<RS>) => number);
  /** Routes that take multipart uploads skip the JSON content-type gate. */
  multipart?: boolean;
  /** Express middleware for this route only, run after the policy check and before the input is parsed. */
  use?: readonly RequestHandler[];
  handler: (
    ctx: RouteContext<z.output<PS>, z.output<QS>, z.output<BS>, ActorOf<Pol>>,
  ) => Promise<DeepReadonly<Out<RS>> | Reply<DeepReadonly<Out<RS>>> | JsonBytes<Out<RS>>>;
}

export interface RegisteredRoute {
  method: Method;
  path: string;
  policy: Policy;
  summary?: string;
  params?: ZodType;
  query?: ZodType;
  body?: ZodType;
  multipart: boolean;
  raw: boolean;
  response: ResponseSpec;
  status: number;
  versioned: boolean;
  /** The route requires If-Match (see `readsIfMatch`). */
  ifMatch: boolean;
}

/** All routes of the API: the deny-by-default test and the OpenAPI document read it. */
export const routeRegistry: RegisteredRoute[] = [];

export interface ApiRouter {
  router: Router;
  route<PS extends ZodType, QS extends ZodType, BS extends ZodType, Pol extends Policy, RS extends ResponseSpec>(
    spec: RouteSpec<PS, QS, BS, Pol, RS>,
  ): void;
}

/** A 2xx answer that does not match its declared schema (only checked where RESPONSE_VALIDATION is on: the tests). */
export class ResponseSchemaError extends AppError {
  constructor(route: string, issues: string) {
    super(500, 'internal', 'Response does not match its schema', `${route}: ${issues}`);
  }
}

const hasBody = (req: Request): boolean =>
  (req.headers['content-length'] !== undefined && req.headers['content-length'] !== '0') ||
  req.headers['transfer-encoding'] !== undefined;

/**
 * Which versioned routes take If-Match: every write to an existing record. A POST is one unless it
 * answers 201 (a create has no version yet; it only sends the new record's ETag).
 */
export function readsIfMatch(method: Method, status: number): boolean {
  if (method === 'put' || method === 'patch' || method === 'delete') return true;
  return method === 'post' && status !== 201;
}

function checkPolicy(policy: Policy, req: Request): LinkGrant | null {
  const actor = req.actor ?? null;
  if (policy.kind === 'roles') {
    if (!actor) throw new UnauthenticatedError();
    if (!policy.roles.includes(actor.role)) throw new ForbiddenError();
  }
  if (policy.kind === 'link') {
    const grant = req.session?.link;
    if (!grant || grant.expiresAt <= Date.now()) throw new UnauthenticatedError();
    // Another proposal is as unknown to this session as one that does not exist.
    if (req.params[policy.param] !== grant.proposalId) throw new NotFoundError('The proposal');
    return grant;
  }
  return null;
}

/**
 * One router per module. `raw` routers are for signed webhooks: the app mounts them before the JSON
 * parser, the session and CSRF (modules/index.ts mountHooks), and each of their routes gets the body as
 * received; every other router refuses a `signed` route, and a raw router refuses anything else.
 */
export function createApiRouter(prefix: string, getServices: () => Services, opts: { raw?: boolean } = {}): ApiRouter {
  const router = express.Router();
  return {
    router,
    route(spec) {
      const fullPath = `${prefix}${spec.path}`;
      if ((spec.policy.kind === 'signed') !== Boolean(opts.raw)) {
        throw new Error(`${spec.method.toUpperCase()} ${fullPath}: signed routes, and only they, go on a raw router`);
      }
      const status = spec.response === NO_CONTENT ? 204 : (spec.status ?? 200);
      const takesIfMatch = spec.versioned !== undefined && readsIfMatch(spec.method, status);
      if (!routeRegistry.some((r) => r.method === spec.method && r.path === fullPath)) {
        routeRegistry.push({
          method: spec.method,
          path: fullPath,
          policy: spec.policy,
          summary: spec.summary,
          params: spec.params,
          query: spec.query,
          body: spec.body,
          multipart: Boolean(spec.multipart),
          raw: Boolean(opts.raw),
          response: spec.response,
          status,
          versioned: spec.versioned !== undefined,
          ifMatch: takesIfMatch,
        });
      }
      const schema = 'safeParse' in spec.response ? (spec.response as ZodType) : null;
      const handlers: RequestHandler[] = [
        (req, res, next) => {
          res.locals.linkGrant = spec.policy.kind === 'signed' ? null : checkPolicy(spec.policy, req);
          next();
        },
      ];
      if (opts.raw) handlers.push(express.raw({ type: () => true, limit: '1mb' }));
      handlers.push(...(spec.use ?? []));
      const main: RequestHandler = async (req, res) => {
        const grant = (res.locals.linkGrant ?? null) as LinkGrant | null;
        const rawBody = opts.raw && Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
        if (spec.policy.kind === 'signed' && !(await spec.policy.verify(rawBody, req))) {
          throw new UnauthenticatedError('The signature does not match.');
        }
        if (!opts.raw && spec.method !== 'get' && !spec.multipart && hasBody(req) && !req.is('application/json')) {
          throw new UnsupportedMediaTypeError();
        }
        const params = spec.params ? parseInput(spec.params, req.params) : req.params;
        const query = spec.query ? parseInput(spec.query, req.query) : {};
        const body = spec.body && !opts.raw ? parseInput(spec.body, req.body ?? {}) : undefined;
        const ifMatch = takesIfMatch ? ifMatchVersion(req) : NaN;
        const em = RequestContext.getEntityManager();
        if (!em) throw new Error('no request context');
        const services = getServices();
        const ctx = {
          req,
          res,
          params,
          query,
          body,
          actor: req.actor ?? null,
          em: em as EntityManager,
          services,
          ifMatch,
          link: grant,
          rawBody,
          service: { em: em as EntityManager, actor: req.actor ?? null, clock: services.clock },
        };
        const result: unknown = await spec.handler(ctx as never);
        if (spec.response === NO_CONTENT) {
          if (!res.headersSent) res.status(204).end();
          return;
        }
        if (!schema) return; // the handler wrote a raw answer
        const bytes = result instanceof JsonBytes ? result.bytes : null;
        const [code, out] =
          result instanceof Reply
            ? [result.status, result.body]
            : bytes && (services.config.RESPONSE_VALIDATION === 'on' || typeof spec.versioned === 'function')
              ? [status, JSON.parse(bytes.toString('utf8')) as unknown]
              : [status, result];
        if (services.config.RESPONSE_VALIDATION === 'on' && code < 300) {
          const check = schema.safeParse(out);
          if (!check.success) {
            const issues = zodToFieldErrors(check.error)
              .map((e) => `${e.path}: ${e.message}`)
              .join('; ');
            throw new ResponseSchemaError(`${spec.method.toUpperCase()} ${fullPath}`, issues);
          }
        }
        if (typeof spec.versioned === 'function') setEtag(res, spec.versioned(out as never));
        if (res.headersSent) return;
        if (bytes) res.status(code).set('Content-Type', 'application/json; charset=utf-8').send(bytes);
        else res.status(code).json(out);
      };
      handlers.push(main);
      router[spec.method](spec.path, ...handlers);
    },
  };
}
