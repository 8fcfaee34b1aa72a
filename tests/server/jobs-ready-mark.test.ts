import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { login } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(async () => t.close());

// `npm test` seeds the demo scenario (one job per company marked ready to propose); read only here.
describe('the jobs list carries the desk’s ready-to-propose mark (issue 13)', () => {
  it.each(demoAccounts.filter((d) => d.role === 'estimator'))(
    '$company: each listed job says when it was marked, exactly as its desk does',
    async (acct) => {
      const s = await login(t.app, acct.email, acct.password);
      const list = await s.agent.get('/api/jobs?pageSize=100');
      expect(list.status).toBe(200);
      const items = list.body.items as { id: string; status: string; readyToProposeAt: string | null }[];
      let marked = 0;
      for (const job of items) {
        expect(job).toHaveProperty('readyToProposeAt');
        const desk = await s.agent.get(`/api/jobs/${job.id}/desk`);
        expect(desk.status).toBe(200);
        expect(job.readyToProposeAt, job.id).toBe(desk.body.readiness.markedReady?.at ?? null);
        if (job.readyToProposeAt) marked += 1;
      }
      expect(marked).toBeGreaterThanOrEqual(1);
      // The single job's read says the same as its list row.
      const first = items.find((j) => j.readyToProposeAt);
      const one = await s.agent.get(`/api/jobs/${first?.id}`);
      expect(one.body.job.readyToProposeAt).toBe(first?.readyToProposeAt);
    },
  );
});
