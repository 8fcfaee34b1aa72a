import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { HISTORY_JOB_NOTE } from '../../fixtures/sales-history-seed';
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
  hasProposal: boolean;
  salesperson: { id: string };
  designConditions: unknown;
  notes: string;
}
interface RoomItem {
  input: { exposedWalls: Array<{ windows: unknown[] }> };
  photos: unknown[];
}

// `npm test` seeds the demo scenario into the test database before the suite (scripts/test.ts).
describe('demo data', () => {
  it.each(demoAccounts.filter((d) => d.role === 'salesperson'))(
    '$company: its salesperson owns walk-through and design jobs, and jobs whose proposals went on, with rooms, windows and photos',
    async (acct) => {
      const s = await login(t.app, acct.email, acct.password);
      const jobs = await s.agent.get('/api/jobs?pageSize=100');
      expect(jobs.status).toBe(200);
      // The sales history before this month (fixtures/sales-history-seed.ts, the owner's reports) is not the
      // demo's current work: its jobs carry HISTORY_JOB_NOTE. The work in walk-through and design is today's and
      // comes first in the list; the demo proposals (fixtures/demo-proposal-states.ts) went out over the last
      // days, so some are older than the newest history.
      const all: JobItem[] = jobs.body.items;
      const items = all.filter((j) => j.notes !== HISTORY_JOB_NOTE);
      const inProgress = items.filter((j) => j.status === 'walkthrough' || j.status === 'design');
      expect(all.slice(0, inProgress.length)).toEqual(inProgress);
      expect(items.length).toBeGreaterThanOrEqual(3);
      const statuses = new Set(items.map((j) => j.status));
      expect(statuses).toContain('walkthrough');
      expect(statuses).toContain('design');
      // The jobs past design are the demo proposals in every state (fixtures/demo-proposal-states.ts): each one's
      // status came from its proposal (proposal-demo.test.ts checks each state).
      for (const job of items)
        if (job.status !== 'walkthrough' && job.status !== 'design') expect(job.hasProposal, job.status).toBe(true);
      expect([...statuses].filter((x) => x !== 'walkthrough' && x !== 'design').length).toBeGreaterThanOrEqual(2);
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

  it('Larkspur: a ducted ranch (attic ducts, R-6, tested leakage) whose loads carry the "Ducts" part in every room', async () => {
    const acct = demoAccounts.find((d) => d.role === 'salesperson' && d.company.startsWith('Larkspur'));
    if (!acct) throw new Error('no Larkspur salesperson');
    const s = await login(t.app, acct.email, acct.password);
    const items: Array<JobItem & { house?: { ducts?: Record<string, unknown> } }> = (
      await s.agent.get('/api/jobs?pageSize=100')
    ).body.items;
    const ducted = [];
    for (const j of items) {
      const job = (await s.agent.get(`/api/jobs/${j.id}`)).body.job as { id: string; house?: { ducts?: object } };
      if (job.house?.ducts) ducted.push(job);
    }
    expect(ducted).toHaveLength(1);
    const [job] = ducted;
    if (!job) throw new Error('no ducted demo job');
    // Invented demo values (fixtures/demo-jobs.ts): attic, R-6 flex, 8 % supply / 6 % return leakage.
    expect(job.house?.ducts).toMatchObject({ location: 'attic', insulationR: 6, supplyLeakageFraction: 0.08 });
    const r = await s.agent.get(`/api/jobs/${job.id}/loads`);
    expect(r.status).toBe(200);
    const load = r.body.loads as {
      rooms: Array<{ roomName: string; sensibleGain: { ducts: number }; heatLoss: { ducts: number } }>;
      sensibleGain: { ducts: number; total: number };
      ducts: { location: string; cooling: { sensibleBtuh: number }; heating: { btuh: number } };
      blockHour: number;
    };
    expect(load.ducts.location).toBe('attic');
    // The loads page shows a "Ducts" row for a room when its duct share is above zero (component-drilldown.tsx).
    for (const room of load.rooms) {
      expect(room.sensibleGain.ducts, room.roomName).toBeGreaterThan(0);
      expect(room.heatLoss.ducts, room.roomName).toBeGreaterThan(0);
    }
    // The home's block figure carries the duct gain of the block hour; the rooms' heat-loss shares add up to
    // the duct loss (apportioned by largest remainder, home-ducts.ts).
    expect(load.sensibleGain.ducts).toBe(load.ducts.cooling.sensibleBtuh);
    expect(load.rooms.reduce((n, x) => n + x.heatLoss.ducts, 0)).toBe(load.ducts.heating.btuh);
  });
});
