import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  MESSAGE_KINDS,
  MESSAGE_STATES,
  JOB_STATUSES,
  mayDeleteJob,
  mayMoveJob,
  moveNeedsProposal,
  movesFor,
  NEEDS_PROPOSAL_MESSAGE,
  PAYMENT_STATES,
  PDF_STATES,
  DEFAULT_LOSS_REASONS,
  PRICE_SETTINGS_ROLES,
  PROPOSAL_EVENT_KINDS,
  roleMayMoveJob,
  nextStatuses,
  ROLES,
  TIGHTNESS,
  UNIT_SYSTEMS,
  type JobStatus,
} from '../../server/src/contract';
import { rolesFor } from '../../client/src/config/nav';
import { routeRegistry } from '../../server/src/lib/route';
import { JobSchema } from '../../server/src/modules/jobs/job.entity';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { del, newJob, patch } from './jobs-helpers';

/**
 * The contract's rules are what the server enforces: the client shows buttons from the same rules,
 * so every move and delete the server accepts is exactly one the contract allows (and the other way round).
 */
let t: TestApp;
let a: TestCompany;
const sessions = {} as Record<(typeof ROLES)[number], Session>;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'ContractRules');
  for (const role of ROLES) sessions[role] = await login(t.app, a.users[role].email);
});
afterAll(async () => t.close());

const newSalespersonJob = () =>
  newJob(sessions.owner, { salespersonId: a.users.salesperson.id, assignedInstallerId: a.users.installer.id });

/** Puts a job straight into a status (the database, not the API, so every start is reachable). */
async function jobIn(status: JobStatus, job?: { id: string }): Promise<{ id: string; version: number }> {
  job ??= await newSalespersonJob();
  const em = t.orm.em.fork();
  await em.nativeUpdate(JobSchema, { id: job.id }, { status, lostReason: null });
  const row = await em.findOneOrFail(JobSchema, { id: job.id });
  return { id: job.id, version: row.version };
}

describe('job status machine', () => {
  it.each(JOB_STATUSES)('from %s, the server accepts exactly the moves the contract allows each role', async (from) => {
    const { id } = await newSalespersonJob();
    for (const to of JOB_STATUSES.filter((s) => s !== from)) {
      for (const role of ROLES) {
        const job = await jobIn(from, { id });
        // Marking a job lost takes a reason from the company's list (here the defaults).
        const body = to === 'lost' ? { status: to, lostReason: DEFAULT_LOSS_REASONS[0] } : { status: to };
        const r = await patch(sessions[role], `/api/jobs/${job.id}`, job.version).send(body);
        // These jobs have no proposal (the job's real fact: no version was issued).
        const allowed = mayMoveJob(role, from, to, { hasProposal: false });
        expect(r.status === 200, `${role}: ${from} → ${to} answered ${r.status}`).toBe(allowed);
        if (!allowed && role !== 'installer' && !nextStatuses(from).includes(to)) expect(r.status).toBe(422);
        if (roleMayMoveJob(role, from, to) && moveNeedsProposal(to)) expect(r.status).toBe(422);
      }
    }
  });
});

describe('a move that needs a proposal', () => {
  it('is refused (422, nothing changed) while the job has no proposal, and the contract offers none', async () => {
    expect(movesFor('salesperson', 'design', { hasProposal: false })).not.toContain('proposed');
    expect(movesFor('salesperson', 'design', { hasProposal: true })).toContain('proposed');
    const job = await jobIn('design');
    const r = await patch(sessions.salesperson, `/api/jobs/${job.id}`, job.version).send({ status: 'proposed' });
    expect(r.status).toBe(422);
    expect(r.body.detail).toBe(NEEDS_PROPOSAL_MESSAGE);
    const row = await t.orm.em.fork().findOneOrFail(JobSchema, { id: job.id });
    expect([row.status, row.version]).toEqual(['design', job.version]);
  });
});

describe('job delete', () => {
  it.each(JOB_STATUSES)('in %s, the server deletes exactly when the contract says the person may', async (status) => {
    for (const role of ROLES) {
      const job = await jobIn(status);
      const viewer = { id: a.users[role].id, role };
      const expected = mayDeleteJob(viewer, { status, salesperson: { id: a.users.salesperson.id } });
      const r = await del(sessions[role], `/api/jobs/${job.id}`, job.version);
      expect(r.status === 204, `${role} deleting a ${status} job answered ${r.status}`).toBe(expected);
    }
  });
});

describe('the database agrees with the contract', () => {
  /**
   * The values a CHECK (… in (…)) constraint or enum check allows, read from PostgreSQL's catalogue (a text
   * column's values print as 'x'::text, a varchar column's as 'x'::character varying).
   */
  async function checkValues(table: string, column: string): Promise<string[]> {
    const rows = await t.orm.em
      .fork()
      .getConnection()
      .execute<{ def: string }[]>(
        `select pg_get_constraintdef(c.oid) as def from pg_constraint c join pg_class r on r.oid = c.conrelid
         where r.relname = ? and c.contype = 'c'`,
        [table],
      );
    // Only a CHECK that is the list alone (not, e.g., "(state in (…)) = (paid_at is not null)").
    const alone = new RegExp(
      `^CHECK \\(+"?${column}"?\\)?(::text)? = ANY \\(+ARRAY\\[[^\\]]*\\]\\)*(::text\\[\\])?\\)*$`,
    );
    const defs = rows.map((r) => r.def).filter((d) => alone.test(d));
    expect(defs, `one CHECK listing ${table}.${column}'s values`).toHaveLength(1);
    return [...(defs[0] ?? '').matchAll(/'([^']+)'::(?:text|character varying)/g)].map((m) => m[1] ?? '');
  }

  it.each([
    ['job', 'tightness', TIGHTNESS],
    ['job', 'status', JOB_STATUSES],
    ['app_user', 'role', ROLES],
    ['company', 'unit_system', UNIT_SYSTEMS],
    ['outgoing_message', 'kind', MESSAGE_KINDS],
    ['outgoing_message', 'state', MESSAGE_STATES],
    // Proposals (issue 14): slices add event kinds in a migration and in the contract; the two must move together.
    ['proposal_event', 'kind', PROPOSAL_EVENT_KINDS],
    ['proposal_version', 'pdf_state', PDF_STATES],
    ['payment', 'state', PAYMENT_STATES],
  ] as const)('%s.%s allows exactly the contract list', async (table, column, list) => {
    expect((await checkValues(table, column)).sort()).toEqual([...list].sort());
  });
});

describe("the client's areas and the server's policies are the same groups", () => {
  /** The roles a registered route's policy lets in. */
  const policyOf = (method: string, path: string): readonly string[] => {
    const r = routeRegistry.find((x) => x.method === method && x.path === path);
    expect(r, `${method} ${path} is registered`).toBeDefined();
    return r?.policy.kind === 'roles' ? r.policy.roles : [];
  };

  it.each([
    ['users', 'get', '/api/users/'],
    ['mail', 'get', '/api/mail/'],
    ['settings', 'put', '/api/company/settings'],
    ['outbox', 'get', '/api/dev/outbox'],
    ['price-book', 'get', '/api/company-data/tables'],
    ['jobs', 'get', '/api/jobs/'],
  ] as const)('the %s area is shown to exactly the roles %s %s lets in', (area, method, path) => {
    expect([...rolesFor(area)].sort()).toEqual([...policyOf(method, path)].sort());
  });

  it('the price-book settings card is shown to exactly who may read the settings', () => {
    expect([...PRICE_SETTINGS_ROLES].sort()).toEqual([...policyOf('get', '/api/company-data/settings')].sort());
  });
});
