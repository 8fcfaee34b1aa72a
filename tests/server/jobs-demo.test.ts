import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { login } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(async () => t.close());

interface JobItem {
  id: string;
  status: string;
  salesperson: { id: string };
  designConditions: unknown;
}
interface RoomItem {
  input: { exposedWalls: Array<{ windows: unknown[] }> };
  photos: unknown[];
}

// `npm test` seeds the demo scenario into the test database before the suite (scripts/test.ts).
describe('demo data', () => {
  it.each(demoAccounts.filter((d) => d.role === 'salesperson'))(
    '$company: its salesperson owns walk-through and design jobs with rooms, windows and photos',
    async (acct) => {
      const s = await login(t.app, acct.email, acct.password);
      const jobs = await s.agent.get('/api/jobs');
      expect(jobs.status).toBe(200);
      const items: JobItem[] = jobs.body.items;
      expect(items.length).toBeGreaterThanOrEqual(3);
      expect(new Set(items.map((j) => j.status))).toEqual(new Set(['walkthrough', 'design']));
      let photos = 0;
      for (const job of items) {
        expect(job.designConditions).not.toBeNull();
        const rooms: RoomItem[] = (await s.agent.get(`/api/jobs/${job.id}/rooms`)).body.rooms;
        expect(rooms.length).toBeGreaterThanOrEqual(2);
        expect(rooms.length).toBeLessThanOrEqual(5);
        for (const r of rooms) expect(r.input.exposedWalls.some((w) => w.windows.length > 0)).toBe(true);
        photos += rooms.reduce((n, r) => n + r.photos.length, 0);
        expect((await s.agent.get(`/api/jobs/${job.id}/loads`)).status).toBe(200);
      }
      expect(photos).toBeGreaterThan(0);
    },
  );
});
