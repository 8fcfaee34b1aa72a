import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { login } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { createLocalDiskStorage } from '../../server/src/services/storage';

/** The demo proposal (fixtures/demo-proposals.ts): `npm test` seeds the demo into the test database first. */
let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(async () => t.close());

const account = (company: string, role: string) => {
  const a = demoAccounts.find((d) => d.role === role && d.company.startsWith(company));
  if (!a) throw new Error(`no demo ${role} of ${company}`);
  return a;
};

describe('demo proposal', () => {
  it('Larkspur: a job with version 1 superseded and version 2 current, both PDFs made, and what changed between them', async () => {
    const acct = account('Larkspur', 'estimator');
    const s = await login(t.app, acct.email, acct.password);
    const jobs = (await s.agent.get('/api/jobs?pageSize=100')).body.items as {
      id: string;
      status: string;
      hasProposal: boolean;
    }[];
    // The issued-not-sent one is still in design (the jobs in every state are proposed, won or lost).
    const withProposal = jobs.filter((j) => j.hasProposal && j.status === 'design');
    expect(withProposal.length).toBeGreaterThanOrEqual(1);
    const jobId = withProposal[0]?.id ?? '';
    const r = await s.agent.get(`/api/jobs/${jobId}/proposal`);
    expect(r.status).toBe(200);
    const versions = r.body.proposal.versions as {
      number: number;
      current: boolean;
      issuedAt: string;
      supersededAt: string | null;
      pdf: { state: string; sha256: string | null };
    }[];
    // Other tests may issue further versions on this database; the demo's two are the first.
    const [v1, v2] = [versions.find((v) => v.number === 1), versions.find((v) => v.number === 2)];
    expect(v1?.supersededAt).not.toBeNull();
    expect(Date.parse(v1?.issuedAt ?? '')).toBeLessThan(Date.parse(v2?.issuedAt ?? ''));
    // The seed stored both PDFs in the demo's storage (STORAGE_DIR; this app has a storage of its own), each
    // under the hash recorded on its version.
    const storage = createLocalDiskStorage(process.env.STORAGE_DIR ?? '.data/uploads');
    const rows = await t.orm.em
      .fork()
      .getConnection()
      .execute<{ number: number; pdf_key: string; pdf_sha256: string }[]>(
        `select v.number, v.pdf_key, v.pdf_sha256 from proposal_version v join proposal p on p.id = v.proposal_id
         where p.job_id = ? and v.number <= 2 order by v.number`,
        [jobId],
      );
    expect(rows.map((x) => x.number)).toEqual([1, 2]);
    for (const [i, v] of [v1, v2].entries()) {
      expect(v?.pdf.state).toBe('ready');
      const row = rows[i];
      const bytes = row ? await storage.get(row.pdf_key) : null;
      expect(bytes?.subarray(0, 5).toString()).toBe('%PDF-');
      expect(
        createHash('sha256')
          .update(bytes ?? '')
          .digest('hex'),
      ).toBe(v?.pdf.sha256);
    }
    const diff = await s.agent.get(`/api/jobs/${jobId}/proposal/versions/1/diff/2`);
    const sentences = (diff.body.changes as { area: string; sentence: string }[]).map((c) => c.sentence);
    // The seed lengthened the bedrooms' line set by 10 ft and raised a deposit from $1,000 to $1,500.
    expect(sentences.some((x) => /run \(ft\) (\d+) → (\d+)/.test(x))).toBe(true);
    expect(sentences.join(' ')).toMatch(/1,000.*1,500|100000.*150000/);
    const kinds = (r.body.proposal.events as { kind: string }[]).map((e) => e.kind).slice(0, 6);
    expect(kinds).toEqual(['issued', 'superseded', 'issued', 'pdf-ready', 'pdf-ready'].concat(kinds.slice(5)));
  });

  it('Quillbrook: a job marked ready to propose is there to issue by hand', async () => {
    const acct = account('Quillbrook', 'estimator');
    const s = await login(t.app, acct.email, acct.password);
    const jobs = (await s.agent.get('/api/jobs?pageSize=100')).body.items as {
      id: string;
      hasProposal: boolean;
      readyToProposeAt: string | null;
    }[];
    expect(jobs.some((j) => j.readyToProposeAt !== null)).toBe(true);
  });
});
