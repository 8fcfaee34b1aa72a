import { createHash, randomBytes, randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CANCELLED_BY_BUYER,
  DEFAULT_LOSS_REASONS,
  PROPOSAL_LINK_OPEN_PATH,
  type ProposalSnapshot,
  type SalesReport,
} from '@contract';
import { renderProposalPdf } from '../../server/src/modules/proposals/pdf/render-proposal';
import {
  browserAgent,
  csrfOf,
  HTTPS,
  isProblem,
  login,
  makeCompany,
  type Session,
  type TestCompany,
} from '../helpers/fixtures';
import { sampleSnapshot } from '../helpers/proposal-snapshot';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { newJob, patch } from './jobs-helpers';

/**
 * Issue 15 (reports15): the owner's sales reports. A small hand-built set of proposals (rows as the real paths
 * leave them) whose figures are worked by hand below; then a job signed through the customer's signing routes
 * and one marked lost by hand, and the report counts them; the owner-only policy and the company scope; bad
 * filters; the CSV with formula cells neutralised.
 */
let t: TestApp;
let db: pg.Client;
let a: TestCompany;
let b: TestCompany;
let owner: Session;
let estimator: Session;
let pdf: Buffer;

const sha256 = (s: string | Buffer) => createHash('sha256').update(s).digest('hex');

beforeAll(async () => {
  t = await buildTestApp({ QUEUE_WORKERS: 'off' });
  a = await makeCompany(t.orm.em.fork(), 'Reports');
  b = await makeCompany(t.orm.em.fork(), 'ReportsB');
  owner = await login(t.app, a.users.owner.email);
  estimator = await login(t.app, a.users.estimator.email);
  db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
  pdf = await renderProposalPdf({ snapshot: sampleSnapshot('Ottoline Breck'), versionNumber: 1, logo: null });
  // Two outdoor units in company A's catalog, each with two rated cooling points (invented test data):
  // RPT-A at 85 °F 24,000 and 95 °F 22,000 Btu/h → at the 90 °F design, halfway: 23,000 Btu/h;
  // RPT-B at 85 °F 38,000 and 95 °F 34,000 Btu/h → at 90 °F: 36,000 Btu/h (linear interpolation, calc's capacityAtOutdoorF).
  for (const [key, kind, lo, hi] of [
    ['RPT-A', 'outdoor-single-zone', 24000, 22000],
    ['RPT-B', 'outdoor-ducted', 38000, 34000],
  ] as const)
    await db.query(
      `insert into company_data_row (id, company_id, dataset, key, data, version, created_at, updated_at)
       values ($1, $2, 'models', $3, $4, 1, now(), now())`,
      [
        randomUUID(),
        a.id,
        key,
        JSON.stringify({
          key,
          name: key,
          kind,
          coolingPoints: [
            { outdoorF: 85, btuh: lo },
            { outdoorF: 95, btuh: hi },
          ],
          heatingPoints: [],
        }),
      ],
    );
}, 60_000);
afterAll(async () => {
  await db?.end();
  await t?.close();
});

interface Opt {
  position: 1 | 2 | 3;
  model: 'RPT-A' | 'RPT-B';
  subtotalDollars: number;
}

/** A snapshot with the given options (the sample's first system, its outdoor unit swapped) and block load. */
function snapshot(blockBtuh: number, options: Opt[]): ProposalSnapshot {
  const s = sampleSnapshot('Ottoline Breck');
  const template = s.options[0]!;
  return {
    ...s,
    design: { ...s.design, conditions: { outdoorCoolingDryBulbF: 90 } },
    loads: { ...s.loads, block: { ...s.loads.block, coolingBtuh: blockBtuh } },
    options: options.map((o) => ({
      ...template,
      position: o.position,
      name: `Option ${o.position}`,
      systems: [
        {
          ...template.systems[0]!,
          zones: template.systems[0]!.zones.slice(0, 1),
          outdoor: {
            ...template.systems[0]!.outdoor,
            key: o.model,
            kind: o.model === 'RPT-A' ? 'outdoor-single-zone' : 'outdoor-ducted',
          },
        },
      ],
      price: {
        ...template.price,
        sellCents: o.subtotalDollars * 100,
        discountCents: 0,
        subtotalCents: o.subtotalDollars * 100,
        taxCents: 0,
        totalCents: o.subtotalDollars * 100,
        depositCents: 0,
        balanceCents: o.subtotalDollars * 100,
      },
    })),
  };
}

interface Made {
  jobId: string;
  proposalId: string;
  versionId: string;
}

/** A job of A (made through the API) with a proposal and version 1 issued at `issued`, its PDF recorded. */
async function proposal(p: { by: 'salesperson' | 'estimator'; visit: string; issued: string; snap: ProposalSnapshot }) {
  const job = await newJob(estimator);
  await db.query(`update job set salesperson_id = $2, created_at = $3 where id = $1`, [
    job.id,
    a.users[p.by].id,
    p.visit,
  ]);
  const proposalId = randomUUID();
  const versionId = randomUUID();
  await db.query(`insert into proposal (id, company_id, job_id, created_at) values ($1, $2, $3, $4)`, [
    proposalId,
    a.id,
    job.id,
    p.issued,
  ]);
  const key = `proposal-pdf-${versionId}`;
  await t.services.storage.put(key, pdf, 'application/pdf');
  await db.query(
    `insert into proposal_version (id, company_id, proposal_id, number, snapshot, snapshot_sha256, calc_version,
       issued_by_id, issued_by_name, issued_at, pdf_state, pdf_sha256, pdf_key)
     values ($1, $2, $3, 1, $4, $5, '0.1.0', $6, 'Test estimator', $7, 'ready', $8, $9)`,
    [
      versionId,
      a.id,
      proposalId,
      JSON.stringify(p.snap),
      sha256(JSON.stringify(p.snap)),
      a.users.estimator.id,
      p.issued,
      sha256(pdf),
      key,
    ],
  );
  await db.query(`update job set status = 'proposed' where id = $1`, [job.id]);
  return { jobId: job.id, proposalId, versionId } satisfies Made;
}

/** The signature row as the signing route writes it (typed), and the job won. */
async function signed(m: Made, position: number, at: string) {
  await db.query(
    `insert into proposal_signature (id, company_id, proposal_id, version_id, option_position, signer_name, signer_email,
       method, typed_name, statement, statement_sha256, document_sha256, snapshot_sha256, consent_sha256, signed_at)
     values ($1, $2, $3, $4, $5, 'Ottoline Breck', 'ottoline@example.com', 'typed', 'Ottoline Breck', 'I accept.', $6, $6, $6, $6, $7)`,
    [randomUUID(), a.id, m.proposalId, m.versionId, position, sha256('x'), at],
  );
  await db.query(`update job set status = 'won' where id = $1`, [m.jobId]);
}

const report = async (s: Session, query = '') => {
  const r = await s.agent.get(`/api/reports/sales${query}`);
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return r.body as SalesReport;
};
const groupOf = (list: SalesReport['byMonth'], key: string) => list.find((g) => g.key === key);

const JAN_FEB = '?from=2026-01-01&to=2026-02-28';
let p5: Made;

describe('the hand-built set (January and February 2026)', () => {
  beforeAll(async () => {
    // P1 (salesperson): visit Jan 5, issued Jan 10; options A $9,000 and B $15,000; block 20,000 Btu/h.
    //   Signed option 2 on Jan 20 → won, revenue $15,000.
    const p1 = await proposal({
      by: 'salesperson',
      visit: '2026-01-05T15:00:00Z',
      issued: '2026-01-10T15:00:00Z',
      snap: snapshot(20000, [
        { position: 1, model: 'RPT-A', subtotalDollars: 9000 },
        { position: 2, model: 'RPT-B', subtotalDollars: 15000 },
      ]),
    });
    await signed(p1, 2, '2026-01-20T15:00:00Z');
    // P2 (salesperson): issued Jan 25, option A $9,500, block 25,000; marked lost "Price too high".
    const p2 = await proposal({
      by: 'salesperson',
      visit: '2026-01-20T15:00:00Z',
      issued: '2026-01-25T15:00:00Z',
      snap: snapshot(25000, [{ position: 1, model: 'RPT-A', subtotalDollars: 9500 }]),
    });
    await db.query(`update job set status = 'lost', lost_reason = $2 where id = $1`, [
      p2.jobId,
      DEFAULT_LOSS_REASONS[0],
    ]);
    // P3 (estimator): visit Feb 1, issued Feb 3; A $8,000 and B $14,000; block 30,000. Signed option 1 on Feb 13.
    const p3 = await proposal({
      by: 'estimator',
      visit: '2026-02-01T15:00:00Z',
      issued: '2026-02-03T15:00:00Z',
      snap: snapshot(30000, [
        { position: 1, model: 'RPT-A', subtotalDollars: 8000 },
        { position: 2, model: 'RPT-B', subtotalDollars: 14000 },
      ]),
    });
    await signed(p3, 1, '2026-02-13T15:00:00Z');
    // P4 (estimator): issued Feb 15, B $16,000, block 32,000; signed Feb 20, cancelled by the buyer Feb 21 → lost.
    const p4 = await proposal({
      by: 'estimator',
      visit: '2026-02-10T15:00:00Z',
      issued: '2026-02-15T15:00:00Z',
      snap: snapshot(32000, [{ position: 1, model: 'RPT-B', subtotalDollars: 16000 }]),
    });
    await signed(p4, 1, '2026-02-20T15:00:00Z');
    await db.query(
      `insert into proposal_cancellation (id, company_id, proposal_id, version_id, at, method, sent_on, by_customer,
         by_user_id, last_day_to_cancel) values ($1, $2, $3, $4, '2026-02-21T15:00:00Z', 'mail', '2026-02-21', false, $5, '2026-02-24')`,
      [randomUUID(), a.id, p4.proposalId, p4.versionId, a.users.owner.id],
    );
    await db.query(`update job set status = 'lost', lost_reason = $2 where id = $1`, [p4.jobId, CANCELLED_BY_BUYER]);
    // P5 (salesperson): issued Mar 1, option A $10,000, block 20,000, still outstanding.
    p5 = await proposal({
      by: 'salesperson',
      visit: '2026-02-25T15:00:00Z',
      issued: '2026-03-01T15:00:00Z',
      snap: snapshot(20000, [{ position: 1, model: 'RPT-A', subtotalDollars: 10000 }]),
    });
  });

  it('totals: win rate won ÷ decided, revenue, average ticket, median days, cancellations', async () => {
    const r = await report(owner, JAN_FEB);
    // P1–P4 issued in the range (P5 is March). Won: P1, P3 = 2. Lost: P2, P4 (cancelled) = 2. Decided 4.
    expect(r.totals).toMatchObject({ proposals: 4, won: 2, lost: 2, decided: 4, outstanding: 0 });
    // Win rate = 2 ÷ 4 = 0.5.
    expect(r.totals.winRate).toBe(0.5);
    // Revenue = P1's option 2 $15,000 + P3's option 1 $8,000 = $23,000 → 2,300,000 cents; ticket = ÷ 2 = $11,500.
    expect(r.totals.revenueCents).toBe(2_300_000);
    expect(r.totals.averageTicketCents).toBe(1_150_000);
    // Days from visit to signature: P1 Jan 5 → Jan 20 = 15; P3 Feb 1 → Feb 13 = 12; median of (12, 15) = 13.5.
    expect(r.totals.medianDaysToSignature).toBe(13.5);
    // Signed: P1, P3, P4 = 3; cancelled within the window: P4 = 1; rate 1 ÷ 3.
    expect(r.cancellations.signed).toBe(3);
    expect(r.cancellations.cancelled).toBe(1);
    expect(r.cancellations.rate).toBeCloseTo(1 / 3, 10);
    expect(r.lostReasons).toEqual([
      { reason: CANCELLED_BY_BUYER, count: 1 },
      { reason: DEFAULT_LOSS_REASONS[0], count: 1 },
    ]);
  });

  it('by salesperson and by month', async () => {
    const r = await report(owner, JAN_FEB);
    // Salesperson: P1 won ($15,000), P2 lost → 1 ÷ 2. Estimator: P3 won ($8,000), P4 lost → 1 ÷ 2.
    expect(groupOf(r.bySalesperson, a.users.salesperson.id)).toMatchObject({
      proposals: 2,
      won: 1,
      lost: 1,
      winRate: 0.5,
      revenueCents: 1_500_000,
    });
    expect(groupOf(r.bySalesperson, a.users.estimator.id)).toMatchObject({
      proposals: 2,
      won: 1,
      lost: 1,
      winRate: 0.5,
      revenueCents: 800_000,
    });
    // January: P1 won, P2 lost. February: P3 won, P4 lost.
    expect(groupOf(r.byMonth, '2026-01')).toMatchObject({
      label: 'Jan 2026',
      won: 1,
      lost: 1,
      revenueCents: 1_500_000,
    });
    expect(groupOf(r.byMonth, '2026-02')).toMatchObject({ label: 'Feb 2026', won: 1, lost: 1, revenueCents: 800_000 });
    // Only the salesperson's: P1, P2.
    const mine = await report(owner, `${JAN_FEB}&salesperson=${a.users.salesperson.id}`);
    expect(mine.totals).toMatchObject({ proposals: 2, won: 1, lost: 1, revenueCents: 1_500_000 });
  });

  it('by option position, system type and sizing band (each option offered counts once)', async () => {
    const r = await report(owner, JAN_FEB);
    // Position 1 offered in P1 (not signed), P2 (lost), P3 (signed: won), P4 (signed but cancelled: lost) → 1 of 4.
    expect(groupOf(r.byOption, '1')).toMatchObject({
      proposals: 4,
      won: 1,
      lost: 3,
      winRate: 0.25,
      revenueCents: 800_000,
    });
    // Position 2 offered in P1 (signed: won) and P3 (not signed) → 1 of 2.
    expect(groupOf(r.byOption, '2')).toMatchObject({
      proposals: 2,
      won: 1,
      lost: 1,
      winRate: 0.5,
      revenueCents: 1_500_000,
    });
    // Single-zone (RPT-A): P1.1, P2.1, P3.1 (won) → 1 of 3. Ducted (RPT-B): P1.2 (won), P3.2, P4.1 → 1 of 3.
    expect(groupOf(r.bySystemType, 'single-zone')).toMatchObject({ proposals: 3, won: 1, revenueCents: 800_000 });
    expect(groupOf(r.bySystemType, 'ducted')).toMatchObject({ proposals: 3, won: 1, revenueCents: 1_500_000 });
    // Capacity at 90 °F ÷ block: P1.1 23,000/20,000 = 1.15 (90–115 %), P1.2 36,000/20,000 = 1.8 (above 130 %, won),
    // P2.1 23,000/25,000 = 0.92 (90–115 %), P3.1 23,000/30,000 = 0.767 (below 90 %, won),
    // P3.2 36,000/30,000 = 1.2 (115–130 %), P4.1 36,000/32,000 = 1.125 (90–115 %).
    expect(groupOf(r.bySizingBand, 'right')).toMatchObject({ proposals: 3, won: 0, lost: 3 });
    expect(groupOf(r.bySizingBand, 'over')).toMatchObject({ proposals: 1, won: 1 });
    expect(groupOf(r.bySizingBand, 'under')).toMatchObject({ proposals: 1, won: 1 });
    expect(groupOf(r.bySizingBand, 'upper')).toMatchObject({ proposals: 1, won: 0 });
  });

  it('a job signed through the customer’s signing routes and one marked lost by hand are counted', async () => {
    const march = '?from=2026-03-01&to=2026-03-31';
    const before = await report(owner, march);
    // P5 outstanding; nothing decided in March yet.
    expect(before.totals).toMatchObject({ proposals: 1, won: 0, lost: 0, outstanding: 1 });

    // P6: issued Mar 2, signed now by the customer through the link, consent and signing routes.
    const p6 = await proposal({
      by: 'estimator',
      visit: '2026-02-27T15:00:00Z',
      issued: '2026-03-02T15:00:00Z',
      snap: snapshot(20000, [{ position: 1, model: 'RPT-A', subtotalDollars: 11000 }]),
    });
    await signThroughLink(p6);
    // P5 marked lost by the owner on the job (the hand move, with a reason from the list).
    const job = (await owner.agent.get(`/api/jobs/${p5.jobId}`)).body.job as { version: number };
    const lost = await patch(owner, `/api/jobs/${p5.jobId}`, job.version).send({
      status: 'lost',
      lostReason: DEFAULT_LOSS_REASONS[1],
    });
    expect(lost.status, JSON.stringify(lost.body)).toBe(200);

    const after = await report(owner, march);
    // P5 lost, P6 won ($11,000): 1 of 2 decided, none outstanding.
    expect(after.totals).toMatchObject({ proposals: 2, won: 1, lost: 1, outstanding: 0, revenueCents: 1_100_000 });
    expect(after.lostReasons).toEqual([{ reason: DEFAULT_LOSS_REASONS[1], count: 1 }]);
  });
});

/** The customer opens an e-mailed link, consents and signs option 1 typed (as signing.test.ts does). */
async function signThroughLink(m: Made) {
  const token = randomBytes(32).toString('base64url');
  await db.query(
    `insert into proposal_link (id, company_id, proposal_id, version_id, token_sha256, recipient, created_at, expires_at)
     values ($1, $2, $3, $4, $5, 'ottoline@example.com', now(), now() + interval '7 days')`,
    [randomUUID(), a.id, m.proposalId, m.versionId, sha256(token)],
  );
  const agent = browserAgent(t.app);
  expect((await agent.get(`${PROPOSAL_LINK_OPEN_PATH}?t=${token}`).set(HTTPS)).status).toBe(303);
  const csrf = await csrfOf(agent);
  const post = (path: string, body: object) =>
    agent.post(`/api/proposals/${m.proposalId}${path}`).set(HTTPS).set('X-CSRF-Token', csrf).send(body);
  expect((await post('/option', { position: 1 })).status).toBe(200);
  const state = (await agent.get(`/api/proposals/${m.proposalId}/signing`).set(HTTPS)).body;
  expect((await post('/consent', { versionNumber: 1, disclosureSha256: state.consent.sha256 })).status).toBe(200);
  const ready = (await agent.get(`/api/proposals/${m.proposalId}/signing`).set(HTTPS)).body;
  const sign = await post('/signature', {
    method: 'typed',
    versionNumber: 1,
    optionPosition: 1,
    statementSha256: ready.statement.sha256,
    signerName: 'Ottoline Breck',
    signerEmail: 'ottoline@example.com',
    typedName: 'Ottoline Breck',
  });
  expect(sign.status, JSON.stringify(sign.body)).toBe(201);
}

describe('who may read it', () => {
  it('the owner only: estimator, salesperson and installer 403, signed out 401', async () => {
    for (const role of ['estimator', 'salesperson', 'installer'] as const) {
      const s = await login(t.app, a.users[role].email);
      for (const path of ['/api/reports/sales', '/api/reports/sales.csv']) {
        const r = await s.agent.get(path);
        expect(r.status, `${role} ${path}`).toBe(403);
        expect(isProblem(r)).toBe(true);
      }
    }
    expect((await browserAgent(t.app).get('/api/reports/sales')).status).toBe(401);
  });

  it('another company’s owner sees none of A’s proposals, and A’s salesperson is a 404 there', async () => {
    const other = await login(t.app, b.users.owner.email);
    const r = await report(other);
    expect(r.totals.proposals).toBe(0);
    expect(r.salespeople.map((p) => p.id)).not.toContain(a.users.salesperson.id);
    const foreign = await other.agent.get(`/api/reports/sales?salesperson=${a.users.salesperson.id}`);
    expect(foreign.status).toBe(404);
    expect(isProblem(foreign)).toBe(true);
  });
});

describe('bad filters', () => {
  it('a leap day is a real date (2024-02-29); the range may be one day', async () => {
    expect((await report(owner, '?from=2024-02-29&to=2024-02-29')).filters).toEqual({
      from: '2024-02-29',
      to: '2024-02-29',
      salesperson: null,
    });
  });

  it.each([
    ['?from=2026-13-01', 'from'],
    ['?from=2026-02-30', 'from'],
    ['?from=yesterday', 'from'],
    ['?from=2026-03-01&to=2026-02-01', 'to'],
    ['?from=2000-01-01&to=2026-01-01', 'to'],
    ['?salesperson=not-an-id', 'salesperson'],
    ['?colour=blue', ''],
  ])('%s → 400 problem+json naming the field', async (query, field) => {
    const r = await owner.agent.get(`/api/reports/sales${query}`);
    expect(r.status).toBe(400);
    expect(isProblem(r)).toBe(true);
    if (field) expect(JSON.stringify(r.body.errors)).toContain(field);
  });
});

describe('CSV export', () => {
  it('the same figures as the report, and cells a spreadsheet would run as formulas start with an apostrophe', async () => {
    // A salesperson's name and a lost reason written by someone hostile (names are the company's own words).
    await db.query(`update app_user set name = '=HYPERLINK("http://x.example","y")' where id = $1`, [
      a.users.salesperson.id,
    ]);
    await db.query(`update job set lost_reason = '@SUM(1+1)' where id = $1`, [p5.jobId]);
    const r = await owner.agent.get(`/api/reports/sales.csv${JAN_FEB.replace('2026-02-28', '2026-03-31')}`);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/^text\/csv/);
    expect(r.headers['content-disposition']).toMatch(
      /attachment; filename="?sales-report-from-2026-01-01-to-2026-03-31\.csv"?/,
    );
    const text = r.text.replace(/^\uFEFF/, '');
    expect(text).toContain(`"'=HYPERLINK(""http://x.example"",""y"")"`);
    expect(text).toContain(`'@SUM(1+1)`);
    // No cell anywhere starts with a formula character.
    for (const line of text.split('\r\n').filter(Boolean))
      for (const cell of line.split(',')) expect(cell.replace(/^"/, '')).not.toMatch(/^[=+\-@\t\r]/);
    // Totals Jan–Mar: P1–P6 = 6 proposals; won P1, P3, P6 = 3; lost P2, P4, P5 = 3; 50.0 %; $15,000 + $8,000 + $11,000.
    expect(text).toContain('Totals,All proposals,6,3,3,6,50.0,34000.00');
  });
});
