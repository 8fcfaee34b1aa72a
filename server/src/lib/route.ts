import type { EntityManager } from '@mikro-orm/postgresql';
import { RequestContext } from '@mikro-orm/core';
import express, { type Request, type Response, type Router } from 'express';
import type { z, ZodType } from 'zod';
import { JOB_EDITOR_ROLES, OFFICE_ROLES, OWNER_ROLES, STAFF_ROLES, type Role } from '@contract';
import { ForbiddenError, UnauthenticatedError, UnsupportedMediaTypeError } from './errors';
import { parseInput } from './validate';
import type { Services } from '../services/services';

/** The signed-in person as every service sees them: the tenant comes from here, never from the request. */
export interface Actor {
  userId: string;
  companyId: string;
  role: Role;
  name: string;
  email: string;
}

/** Deny by default: every route states who may call it. */
export interface PublicPolicy {
  kind: 'public';
}
export interface RolesPolicy {
  kind: 'roles';
  roles: readonly Role[];
}
export type Policy = PublicPolicy | RolesPolicy;
export const PUBLIC: PublicPolicy = { kind: 'public' };
export const roles = (...r: Role[]): RolesPolicy => ({ kind: 'roles', roles: r });
export const ANY_STAFF = roles(...STAFF_ROLES);
/** The contract's role groups as policies. */
export const JOB_EDITORS = roles(...JOB_EDITOR_ROLES);
export const OFFICE = roles(...OFFICE_ROLES);
export const OWNER = roles(...OWNER_ROLES);

export interface RouteContext<P, Q, B, A> {
  req: Request;
  res: Response;
  params: P;
  query: Q;
  body: B;
  actor: A;
  em: EntityManager;
  services: Services;
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec<PS extends ZodType, QS extends ZodType, BS extends ZodType, Pol extends Policy> {
  method: Method;
  path: string;
  policy: Pol;
  params?: PS;
  query?: QS;
  body?: BS;
  /** Routes that take multipart uploads skip the JSON content-type gate. */
  multipart?: boolean;
  /** Return a value to send it as JSON (status 200, or `status`); return undefined when the handler wrote the response. */
  handler: (
    ctx: RouteContext<z.output<PS>, z.output<QS>, z.output<BS>, [Pol] extends [PublicPolicy] ? Actor | null : Actor>,
  ) => Promise<unknown>;
  status?: number;
}

export interface RegisteredRoute {
  method: Method;
  path: string;
  policy: Policy;
}

/** All routes of the API, for the deny-by-default test and the docs. */
export const routeRegistry: RegisteredRoute[] = [];

export interface ApiRouter {
  router: Router;
  route<PS extends ZodType, QS extends ZodType, BS extends ZodType, Pol extends Policy>(
    spec: RouteSpec<PS, QS, BS, Pol>,
  ): void;
}

const hasBody = (req: Request): boolean =>
  (req.headers['content-length'] !== undefined && req.headers['content-length'] !== '0') ||
  req.headers['transfer-encoding'] !== undefined;

export function createApiRouter(prefix: string, getServices: () => Services): ApiRouter {
  const router = express.Router();
  return {
    router,
    route(spec) {
      const fullPath = `${prefix}${spec.path}`;
      if (!routeRegistry.some((r) => r.method === spec.method && r.path === fullPath)) {
        routeRegistry.push({ method: spec.method, path: fullPath, policy: spec.policy });
      }
      router[spec.method](spec.path, async (req: Request, res: Response) => {
        const actor = req.actor ?? null;
        if (spec.policy.kind === 'roles') {
          if (!actor) throw new UnauthenticatedError();
          if (!spec.policy.roles.includes(actor.role)) throw new ForbiddenError();
        }
        if (spec.method !== 'get' && !spec.multipart && hasBody(req) && !req.is('application/json')) {
          throw new UnsupportedMediaTypeError();
        }
        const params = spec.params ? parseInput(spec.params, req.params) : req.params;
        const query = spec.query ? parseInput(spec.query, req.query) : {};
        const body = spec.body ? parseInput(spec.body, req.body ?? {}) : undefined;
        const em = RequestContext.getEntityManager();
        if (!em) throw new Error('no request context');
        const ctx = { req, res, params, query, body, actor, em: em as EntityManager, services: getServices() };
        const out = await spec.handler(ctx as never);
        if (out !== undefined && !res.headersSent) res.status(spec.status ?? 200).json(out);
      });
    },
  };
}
