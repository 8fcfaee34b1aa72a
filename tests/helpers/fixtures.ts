import type { EntityManager } from '@mikro-orm/postgresql';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { CookieAccessInfo } from 'cookiejar';
import type { Express } from 'express';
import { CompanySchema } from '../../server/src/modules/companies/company.entity';
import { CompanyProposalDetailsSchema } from '../../server/src/modules/company-settings/proposal-details.entity';
import { ROLES, type Role } from '../../server/src/contract';
import { UserSchema } from '../../server/src/modules/users/user.entity';
import { hashPassword } from '../../server/src/services/passwords';

export const HTTPS = { 'X-Forwarded-Proto': 'https' } as const;
export const TEST_PASSWORD = 'correct-horse-battery-9';

let hash: Promise<string> | undefined;
const passwordHash = () => (hash ??= hashPassword(TEST_PASSWORD));

export interface TestCompany {
  id: string;
  name: string;
  users: Record<Role, { id: string; email: string; name: string }>;
}

/** The invented business address a test company's proposals carry (issuing needs one: 16 CFR 429.1). */
export const TEST_BUSINESS_ADDRESS = '1 Testbed Row\nQuillmere, Demo State 00042';

/**
 * A fresh company with one active user of every role; unique e-mails so test files can run in parallel.
 * It has a business address in its proposal details (a proposal is issued only with one) unless
 * `businessAddress: false` (a company that never saved its proposal details).
 */
export async function makeCompany(
  em: EntityManager,
  label = 'Test',
  opts: { businessAddress?: boolean } = {},
): Promise<TestCompany> {
  const tag = randomUUID().slice(0, 8);
  const company = em.create(CompanySchema, {
    id: randomUUID(),
    name: `${label} Company ${tag}`,
    unitSystem: 'imperial',
  });
  const users = {} as Record<Role, { id: string; email: string; name: string }>;
  for (const role of ROLES) {
    const u = em.create(UserSchema, {
      id: randomUUID(),
      company,
      name: `${label} ${role} ${tag}`,
      email: `${role}-${tag}@${label.toLowerCase()}.example.com`,
      role,
      active: true,
      passwordHash: await passwordHash(),
    });
    users[role] = { id: u.id, email: u.email, name: u.name };
  }
  if (opts.businessAddress !== false)
    em.create(CompanyProposalDetailsSchema, {
      company,
      address: TEST_BUSINESS_ADDRESS,
      phone: '',
      email: '',
      licence: '',
      terms: '',
      warranty: '',
      cancellationExtra: '',
    });
  await em.flush();
  return { id: company.id, name: company.name, users };
}

export interface Session {
  agent: ReturnType<typeof request.agent>;
  csrf: string;
  cookie: string[];
}

type Agent = ReturnType<typeof request.agent>;
interface CookieJarAgent {
  jar: { getCookies(access: unknown): { toValueString(): string } };
  _attachCookies(req: { url: string; cookies: string }): void;
}

/**
 * A supertest agent (on the app, or on a server's URL) that behaves like a browser behind the TLS-terminating proxy: it says
 * X-Forwarded-Proto: https and sends back Secure (`__Host-`) cookies, which the stock agent
 * only does for https URLs (security plan, harness trap G1).
 */
export function browserAgent(app: Express | string): Agent {
  const agent = request.agent(app);
  agent.set('X-Forwarded-Proto', 'https');
  const patched = agent as unknown as CookieJarAgent;
  patched._attachCookies = (req) => {
    const url = new URL(req.url);
    req.cookies = patched.jar.getCookies(new CookieAccessInfo(url.hostname, url.pathname, true)).toValueString();
  };
  return agent;
}

export async function csrfOf(agent: ReturnType<typeof request.agent>): Promise<string> {
  const r = await agent.get('/api/auth/csrf').set(HTTPS);
  return String(r.body.token);
}

/** Signs in through the API as a browser would (pre-session CSRF token, then the rotated one). */
export async function login(app: Express | string, email: string, password = TEST_PASSWORD): Promise<Session> {
  const agent = browserAgent(app);
  const pre = await csrfOf(agent);
  const res = await agent.post('/api/auth/login').set(HTTPS).set('X-CSRF-Token', pre).send({ email, password });
  if (res.status !== 200) throw new Error(`login ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  return { agent, csrf: await csrfOf(agent), cookie };
}

export const isProblem = (r: request.Response): boolean =>
  /^application\/problem\+json/.test(String(r.headers['content-type'] ?? '')) &&
  typeof r.body.type === 'string' &&
  typeof r.body.title === 'string' &&
  r.body.status === r.status;
