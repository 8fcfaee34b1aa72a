import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EntityManager } from '@mikro-orm/postgresql';
import { DESK_MESSAGES, type BlockerRecord } from '@contract';
import { demoAccounts } from '../../fixtures/seed';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import type { Actor } from '../../server/src/lib/route';
import { systemClock } from '../../server/src/services/services';
import { findJob } from '../../server/src/modules/jobs/job-access';
import { RoomSchema } from '../../server/src/modules/rooms/room.entity';
import { computeOption, engineData, parseHome } from '../../server/src/modules/desk/desk-compute';
import { loadCompanyDesk } from '../../server/src/modules/desk/desk-inputs';
import { homeOf, listOptions } from '../../server/src/modules/desk/desk-read';
import { presentDesk } from '../../server/src/modules/desk/desk.presenter';
import { patch, post, sampleRoom } from './jobs-helpers';
import { BASE, put } from './company-data-helpers';
import { deskJob, multiZone, newOption, seedData, singleZone } from './desk-helpers';

/**
 * GET …/desk reads by SQL and keeps what it worked out, and each option's JSON, by a hash of exactly its inputs
 * (desk-read.ts, desk.presenter.ts presentDeskBytes). These checks hold its answer, byte for byte, to the desk
 * as the ORM path built it: the job, its rooms and options as entities, the company's rows parsed, every
 * option worked out afresh, presentDesk and JSON.stringify.
 */
let t: TestApp;

beforeAll(async () => {
  t = await buildTestApp();
});
afterAll(async () => t.close());

async function actorOf(s: Session): Promise<Actor> {
  const me = (await s.agent.get('/api/auth/me')).body as {
    user: { id: string; name: string; email: string; role: Actor['role'] };
    company: { id: string };
  };
  return { userId: me.user.id, companyId: me.company.id, role: me.user.role, name: me.user.name, email: me.user.email };
}

/** The desk's answer as the ORM path built it, nothing kept from an earlier request. */
async function ormDesk(em: EntityManager, actor: Actor, jobId: string): Promise<string> {
  const ctx = { em, actor, clock: systemClock };
  const job = await findJob(ctx, jobId);
  await em.populate(job, ['readyBy']);
  const rooms = await em.find(
    RoomSchema,
    { job: job.id },
    { orderBy: { position: 'asc', createdAt: 'asc', id: 'asc' } },
  );
  const data = engineData(await loadCompanyDesk(em, actor.companyId));
  const home = parseHome(
    homeOf(
      job,
      rooms.map((r) => r.input),
    ),
  );
  const options = (await listOptions(ctx, job.id)).map((option) => ({
    option,
    computed: computeOption(option, home, data),
  }));
  const blockers: BlockerRecord[] = options.length
    ? options.flatMap((o) => o.computed.blockers)
    : [{ code: 'no-options', optionId: null, message: DESK_MESSAGES.noOptions }];
  return JSON.stringify(
    presentDesk({ desk: { job, home, data, homeKey: '', dataKey: '' }, options, blockers }, actor.role),
  );
}

/** GET …/desk as text, checked against the ORM path's answer. */
async function sameDesk(s: Session, actor: Actor, jobId: string): Promise<string> {
  const res = await s.agent.get(`/api/jobs/${jobId}/desk`);
  expect(res.status, res.text.slice(0, 300)).toBe(200);
  // The headers res.json sends; the options' bytes may be kept ones (desk.presenter.ts presentDeskBytes).
  expect(res.headers['content-type']).toBe('application/json; charset=utf-8');
  expect(res.text).toBe(await ormDesk(t.orm.em.fork(), actor, jobId));
  return res.text;
}

// `npm test` seeds the demo scenario into the test database before the suite (scripts/test.ts).
describe('GET …/desk read by SQL', () => {
  // The demo assigns no job to its installers; the next test reads as an installer.
  it.each(demoAccounts.filter((d) => d.role !== 'installer'))(
    "answers $role of $company, for every demo job they see, the ORM path's very body (worked out, then kept)",
    async (acct) => {
      const s = await login(t.app, acct.email, acct.password);
      const actor = await actorOf(s);
      const jobs = (await s.agent.get('/api/jobs?pageSize=100')).body.items as { id: string; status: string }[];
      expect(jobs.length).toBeGreaterThan(0);
      let withOptions = 0;
      for (const job of jobs) {
        const first = await sameDesk(s, actor, job.id);
        // The second read finds every figure already worked out from the same inputs: the same body.
        expect(await sameDesk(s, actor, job.id)).toBe(first);
        if ((JSON.parse(first) as { options: unknown[] }).options.length) withOptions += 1;
      }
      expect(withOptions).toBeGreaterThan(0);
    },
  );
});

describe('what the desk keeps is never stale and never another company’s', () => {
  let a: TestCompany;
  let b: TestCompany;
  let estimatorA: Session;
  let estimatorB: Session;
  let ownerA: Session;

  beforeAll(async () => {
    a = await makeCompany(t.orm.em.fork(), 'DeskReadA');
    b = await makeCompany(t.orm.em.fork(), 'DeskReadB');
    await seedData(t.orm.em.fork(), a.id);
    await seedData(t.orm.em.fork(), b.id);
    estimatorA = await login(t.app, a.users.estimator.email);
    estimatorB = await login(t.app, b.users.estimator.email);
    ownerA = await login(t.app, a.users.owner.email);
  });

  it('shows every write to what an option is worked out from on the next read: rooms, the job, the price book, the settings, the option', async () => {
    const actor = await actorOf(estimatorA);
    const ownerActor = await actorOf(ownerA);
    const actorB = await actorOf(estimatorB);
    // The same home and options in both companies, on the same catalog and price book.
    const { job, rooms } = await deskJob(estimatorA);
    const twin = await deskJob(estimatorB);
    await newOption(estimatorA, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const whole = await newOption(estimatorA, job.id, { name: 'Whole-home', design: multiZone(rooms) });
    await newOption(estimatorB, twin.job.id, { name: 'Essential', design: singleZone(twin.rooms[0] ?? '') });
    let body = await sameDesk(estimatorA, actor, job.id);
    const bodyB = await sameDesk(estimatorB, actorB, twin.job.id);

    /** After each write: A's desk changed and is the ORM path's; B's desk, the same inputs but its own, did not move. */
    const changed = async (what: string, write: () => Promise<{ status: number; text: string }>) => {
      const r = await write();
      expect(r.status, `${what}: ${r.text.slice(0, 300)}`).toBeLessThan(300);
      const now = await sameDesk(estimatorA, actor, job.id);
      expect(now, what).not.toBe(body);
      body = now;
      expect(await sameDesk(estimatorB, actorB, twin.job.id), what).toBe(bodyB);
    };

    const room = (await estimatorA.agent.get(`/api/jobs/${job.id}/rooms`)).body.rooms[0] as {
      id: string;
      version: number;
    };
    await changed('a room', () =>
      patch(estimatorA, `/api/jobs/${job.id}/rooms/${room.id}`, room.version).send({
        input: { ...sampleRoom('Living room'), lengthFt: 26 },
      }),
    );
    // A room upstairs: the house's stack height doubles, so every room's air leakage (ASHRAE Fundamentals 2021
    // ch. 17 eq. (10)) and the option's loads move, though the new room is in no zone.
    await changed('a room added', () =>
      post(estimatorA, `/api/jobs/${job.id}/rooms`).send({ input: { ...sampleRoom('Den'), floorLevel: 2 } }),
    );
    const j = (await estimatorA.agent.get(`/api/jobs/${job.id}`)).body.job as { version: number };
    await changed("the home's tightness", () =>
      patch(estimatorA, `/api/jobs/${job.id}`, j.version).send({ tightness: 'leaky' }),
    );
    const model = (await ownerA.agent.get(`${BASE}/models/TSL-S12H-O`)).body.row as {
      record: { costCents: number };
      version: number;
    };
    await changed("a catalog model's cost", () =>
      put(ownerA, `${BASE}/models/TSL-S12H-O`, model.version).send({
        record: { ...model.record, costCents: model.record.costCents + 1234 },
      }),
    );
    const settings = (await ownerA.agent.get(`${BASE}/settings`)).body.settings as {
      version: number;
      [k: string]: unknown;
    };
    const { version: settingsVersion, ...currentSettings } = settings;
    await changed('the tax rate', () =>
      put(ownerA, `${BASE}/settings`, settingsVersion).send({
        settings: { ...currentSettings, taxRatePercent: 9.25 },
      }),
    );
    const url = `/api/jobs/${job.id}/options/${whole.id}`;
    let version = whole.version;
    const write = async (r: Promise<{ status: number; text: string; body: { option?: { version: number } } }>) => {
      const done = await r;
      version = done.body.option?.version ?? version;
      return done;
    };
    await changed("an option's deposit", () =>
      write(patch(estimatorA, url, version).send({ pricing: { deposit: { kind: 'percent', value: 25 } } })),
    );
    // Takeoff edits: changed, removed and added lines (the kept figures carry the option's own edits).
    await changed("an option's takeoff edits", () =>
      write(
        estimatorA.agent
          .put(`${url}/takeoff-edits`)
          .set('X-CSRF-Token', estimatorA.csrf)
          .set('If-Match', `"${version}"`)
          .send({
            edits: [
              { kind: 'quantity', itemKey: 'comm-cable:14-4', quantity: 50 },
              { kind: 'remove', itemKey: 'fasteners:kit' },
              {
                kind: 'add',
                id: 'surge',
                description: 'Surge protector',
                quantity: 1,
                unit: 'each',
                category: 'material',
                unitCostCents: 4500,
              },
            ],
          }),
      ),
    );
    // A longer line: the quantity edit no longer applies (stale), and says so.
    const design = multiZone(rooms, [25, 35, 70]);
    await changed('a longer line set', () => write(patch(estimatorA, url, version).send({ design })));
    expect(body).toContain('takeoff-edits-stale');
    // The owner and the job's installer read the same kept figures, each presented for their role.
    await sameDesk(ownerA, ownerActor, job.id);
    const now = (await estimatorA.agent.get(`/api/jobs/${job.id}`)).body.job as { version: number };
    const assigned = await patch(estimatorA, `/api/jobs/${job.id}`, now.version).send({
      assignedInstallerId: a.users.installer.id,
    });
    expect(assigned.status, assigned.text.slice(0, 300)).toBe(200);
    const installer = await login(t.app, a.users.installer.email);
    await sameDesk(installer, await actorOf(installer), job.id);
  });
});
