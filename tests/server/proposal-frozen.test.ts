import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { login, makeCompany } from '../helpers/fixtures';
import { buildTestApp, testDatabaseUrl, type TestApp } from '../helpers/test-app';
import { newJob } from './jobs-helpers';

/**
 * Issue 14: PostgreSQL keeps an issued version frozen (migration …070000_proposals' trigger), whatever the
 * code does. Tried here with raw SQL on the real test database, as anyone with a connection could.
 */
let t: TestApp;
let db: pg.Client;
let companyId: string;
let proposalId: string;
let userId: string;
beforeAll(async () => {
  t = await buildTestApp();
  const c = await makeCompany(t.orm.em.fork(), 'Frozen');
  companyId = c.id;
  userId = c.users.estimator.id;
  const s = await login(t.app, c.users.estimator.email);
  const job = await newJob(s);
  db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
  proposalId = randomUUID();
  await db.query(`insert into proposal (id, company_id, job_id, created_at) values ($1, $2, $3, now())`, [
    proposalId,
    companyId,
    job.id,
  ]);
});
afterAll(async () => {
  await db.end();
  await t.close();
});

const SHA = 'a'.repeat(64);
async function insertVersion(number: number): Promise<string> {
  const id = randomUUID();
  // One current version per proposal (a partial unique index): the one before is superseded first.
  await db.query(`update proposal_version set superseded_at = now() where proposal_id = $1 and superseded_at is null`, [
    proposalId,
  ]);
  await db.query(
    `insert into proposal_version (id, company_id, proposal_id, number, snapshot, snapshot_sha256, calc_version,
       issued_by_id, issued_by_name, issued_at) values ($1, $2, $3, $4, $5, $6, '0.1.0', $7, 'Test estimator', now())`,
    [id, companyId, proposalId, number, JSON.stringify({ schema: 1, n: number }), SHA, userId],
  );
  return id;
}
const refused = (sql: string, params: unknown[]) => expect(db.query(sql, params)).rejects.toThrow(/frozen/);

describe('a proposal version is frozen in PostgreSQL', () => {
  it('refuses an UPDATE of each frozen column and any DELETE, with a clear error', async () => {
    const id = await insertVersion(1);
    await refused(`update proposal_version set snapshot = '{"schema":1,"tampered":true}' where id = $1`, [id]);
    await refused(`update proposal_version set snapshot = jsonb_set(snapshot, '{n}', '2') where id = $1`, [id]);
    await refused(`update proposal_version set snapshot_sha256 = $2 where id = $1`, [id, 'b'.repeat(64)]);
    await refused(`update proposal_version set number = 7 where id = $1`, [id]);
    await refused(`update proposal_version set calc_version = '9.9.9' where id = $1`, [id]);
    await refused(`update proposal_version set issued_at = issued_at - interval '1 day' where id = $1`, [id]);
    await refused(`update proposal_version set issued_by_name = 'Someone else' where id = $1`, [id]);
    await refused(`update proposal_version set issued_by_id = null where id = $1`, [id]);
    await refused(`delete from proposal_version where id = $1`, [id]);
    const row = await db.query(`select snapshot, number from proposal_version where id = $1`, [id]);
    expect(row.rows).toEqual([{ snapshot: { schema: 1, n: 1 }, number: 1 }]);
    // The message says what was refused and why.
    await expect(db.query(`delete from proposal_version where id = $1`, [id])).rejects.toThrow(
      'proposal version 1 is frozen: a version is never deleted',
    );
  });

  it('allows superseded_at once, from NULL to a time, and never again', async () => {
    const id = await insertVersion(2);
    await db.query(`update proposal_version set superseded_at = now() where id = $1`, [id]);
    await refused(`update proposal_version set superseded_at = now() + interval '1 hour' where id = $1`, [id]);
    await refused(`update proposal_version set superseded_at = null where id = $1`, [id]);
  });

  it('allows the PDF columns while no PDF hash is recorded, then fixes them', async () => {
    const id = await insertVersion(3);
    await db.query(`update proposal_version set pdf_state = 'rendering' where id = $1`, [id]);
    await db.query(`update proposal_version set pdf_state = 'failed' where id = $1`, [id]);
    await db.query(
      `update proposal_version set pdf_state = 'ready', pdf_sha256 = $2, pdf_key = 'proposals/x.pdf' where id = $1`,
      [id, 'c'.repeat(64)],
    );
    await refused(`update proposal_version set pdf_key = 'proposals/y.pdf' where id = $1`, [id]);
    await refused(`update proposal_version set pdf_sha256 = $2 where id = $1`, [id, 'd'.repeat(64)]);
    await refused(`update proposal_version set pdf_state = 'failed' where id = $1`, [id]);
    // A 'ready' state without its hash and key is refused by a CHECK.
    const other = await insertVersion(4);
    await expect(db.query(`update proposal_version set pdf_state = 'ready' where id = $1`, [other])).rejects.toThrow(
      /proposal_version_pdf_ready/,
    );
  });

  it('keeps the audit trail insert-only', async () => {
    const r = await db.query<{ id: string; seq: string }>(
      `insert into proposal_event (id, company_id, proposal_id, kind, at, by_user_id) values ($1, $2, $3, 'issued', now(), $4)
       returning id, seq`,
      [randomUUID(), companyId, proposalId, userId],
    );
    const ev = r.rows[0]!;
    await expect(db.query(`update proposal_event set kind = 'sent' where id = $1`, [ev.id])).rejects.toThrow(
      /insert-only/,
    );
    await expect(db.query(`delete from proposal_event where id = $1`, [ev.id])).rejects.toThrow(/insert-only/);
    await expect(
      db.query(
        `insert into proposal_event (id, company_id, proposal_id, kind, at) values ($1, $2, $3, 'made-up', now())`,
        [randomUUID(), companyId, proposalId],
      ),
    ).rejects.toThrow(/check constraint/);
  });
});
