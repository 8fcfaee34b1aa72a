import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { del, expectProblem, newRoom, patch, post, sampleRoom } from './jobs-helpers';
import { deskJob, newOption, seedData, singleZone } from './desk-helpers';
import { CompanyDataRowSchema } from '../../server/src/modules/company-data/company-data.entity';

let t: TestApp;
let a: TestCompany;
let owner: Session;
let estimator: Session;
let sales: Session;
let otherEstimator: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'DeskReady');
  await seedData(t.orm.em.fork(), a.id);
  const b = await makeCompany(t.orm.em.fork(), 'DeskReadyB');
  await seedData(t.orm.em.fork(), b.id);
  owner = await login(t.app, a.users.owner.email);
  estimator = await login(t.app, a.users.estimator.email);
  sales = await login(t.app, a.users.salesperson.email);
  otherEstimator = await login(t.app, b.users.estimator.email);
});
afterAll(async () => t.close());

const optionUrl = (jobId: string, id: string) => `/api/jobs/${jobId}/options/${id}`;
const REASON = 'The owner keeps this room at 68 °F for a home studio; the larger unit is wanted.';
const codes = (r: { body: { blockers: { code: string }[] } }) => new Set(r.body.blockers.map((b) => b.code));
/** The desk holds the approved discount back for the owner again because the price under it dropped. */
const waitsBecausePriceDropped = (desk: { readiness: { blockers: { code: string; message: string }[] } }) =>
  desk.readiness.blockers.some((b) => b.code === 'discount-pending' && b.message.includes('price has dropped'));

/** A 9k single-zone pair (cheaper than the 12k of singleZone). */
function nineK(roomId: string) {
  const d = singleZone(roomId);
  return {
    ...d,
    zones: d.zones.map((z) => ({ ...z, indoorUnitKey: 'TSL-S9H-W' })),
    systems: d.systems.map((s) => ({ ...s, outdoorUnitKey: 'TSL-S9H-O' })),
  };
}

describe('ready to propose needs every unit within its sizing range, or the office’s reason', () => {
  it('refuses oversized units with the reason field named; with a reason marks it, keeps who/when/why, and shows it on the desk and in the explanation', async () => {
    const { job, rooms } = await deskJob(estimator);
    // One 12k pair on one 16 × 12 ft room: about 250 % of its cooling load, outside the 90–130 % policy.
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const refused = await post(estimator, `/api/jobs/${job.id}/ready`).send();
    expectProblem(refused, 422);
    expect(codes(refused)).toEqual(new Set(['sizing-outside-range']));
    expect(refused.body.errors.map((e: { path: string }) => e.path)).toContain('sizingOverride.reason');
    expect(refused.body.blockers[0].message).toMatch(
      /^Essential: Living: cooling \d+ % of the load: above the 90–130 %/,
    );

    // Too short a reason is refused on its field, and nothing is marked.
    const short = await post(estimator, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: 'ok' } });
    expectProblem(short, 400);
    expect(short.body.errors.map((e: { path: string }) => e.path)).toContain('sizingOverride.reason');
    // A salesperson may not mark it, reason or not; another company does not see the job.
    expectProblem(await post(sales, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: REASON } }), 403);
    expectProblem(
      await post(otherEstimator, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: REASON } }),
      404,
    );
    expect((await estimator.agent.get(`/api/jobs/${job.id}/desk`)).body.readiness.markedReady).toBeNull();

    const ok = await post(estimator, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: `  ${REASON} ` } });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    const desk = (await estimator.agent.get(`/api/jobs/${job.id}/desk`)).body;
    expect(desk.readiness.ready).toBe(true);
    expect(desk.readiness.sizingOverride).toMatchObject({
      reason: REASON,
      by: { id: a.users.estimator.id, name: a.users.estimator.name },
    });
    expect(desk.readiness.sizingOverride.units).toEqual(
      refused.body.blockers.map((b: { message: string }) => b.message),
    );
    expect(Date.parse(desk.readiness.sizingOverride.at)).not.toBeNaN();
    // The sizing explanation itself says it was proposed anyway, by whom and why.
    const ratioOf = (d: typeof desk) =>
      d.options[0].result.zones[0].explanations.find((e: { key: string }) => e.key === 'zone:z1:cooling-ratio');
    const ratio = ratioOf(desk);
    expect(ratio.verdict).toContain(`Proposed anyway by ${a.users.estimator.name}`);
    expect(ratio.verdict).toContain(REASON);

    // Any change to an option takes the mark and its reason off.
    await patch(estimator, optionUrl(job.id, o.id), o.version).send({ name: 'Essential plus' });
    const after = (await estimator.agent.get(`/api/jobs/${job.id}/desk`)).body;
    expect(after.readiness.markedReady).toBeNull();
    expect(after.readiness.sizingOverride).toBeNull();
    expect(ratioOf(after).verdict).not.toContain('Proposed anyway');
  });

  it('a reason covers sizing only: a maker’s limit exceeded still refuses, and unmarking clears the reason', async () => {
    const { job, rooms } = await deskJob(estimator);
    await newOption(estimator, job.id, { name: 'Long run', design: singleZone(rooms[0] ?? '', 120) });
    const refused = await post(estimator, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: REASON } });
    expectProblem(refused, 422);
    expect(codes(refused).has('limit-exceeded')).toBe(true);
    expect((await estimator.agent.get(`/api/jobs/${job.id}/desk`)).body.readiness.markedReady).toBeNull();

    const { job: j2, rooms: r2 } = await deskJob(estimator);
    await newOption(estimator, j2.id, { name: 'Essential', design: singleZone(r2[0] ?? '') });
    expect((await post(owner, `/api/jobs/${j2.id}/ready`).send({ sizingOverride: { reason: REASON } })).status).toBe(
      200,
    );
    const off = await estimator.agent.delete(`/api/jobs/${j2.id}/ready`).set('X-CSRF-Token', estimator.csrf);
    expect(off.status).toBe(200);
    expect(off.body.readiness.sizingOverride).toBeNull();
    expect(off.body.readiness.markedReady).toBeNull();
  });
});

describe('an approved discount is checked again when the price drops', () => {
  it('an amount approved at 11 % becomes a larger share on a cheaper design: it waits for the owner again, with the reason, and is not applied', async () => {
    const { job, rooms } = await deskJob(sales);
    const o = await newOption(sales, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = optionUrl(job.id, o.id);
    const sell = (o.result as { price: { sellCents: number } }).price.sellCents;
    const amount = Math.round(sell * 0.11);
    // The demo price book allows a salesperson 10 %: 11 % waits for the owner, who approves it.
    const asked = await patch(sales, url, o.version).send({
      pricing: { discounts: [{ label: 'Neighbour referral', kind: 'amount', value: amount }] },
    });
    expect(asked.body.option.discountRequest.state).toBe('pending');
    const approved = await post(owner, `${url}/discount-decision`)
      .set('If-Match', `"${asked.body.option.version}"`)
      .send({ approve: true });
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    const approvedPercent = approved.body.option.discountRequest.percent as number;
    expect(approvedPercent).toBeCloseTo(11, 1);
    expect(approved.body.option.result.price.discountCents).toBe(amount);

    // The estimator moves the option to the cheaper 9k pair: the same dollars are now a larger share of the price.
    const cheaper = await patch(estimator, url, approved.body.option.version).send({ design: nineK(rooms[0] ?? '') });
    expect(cheaper.status, JSON.stringify(cheaper.body)).toBe(200);
    const opt = cheaper.body.option;
    const sellNow = opt.result.price.sellCents as number;
    expect(sellNow).toBeLessThan(sell);
    const expectedPercent = Math.round((amount / sellNow) * 10000) / 100;
    expect(opt.discountRequest).toMatchObject({ state: 'pending', percent: expectedPercent, decidedBy: null });
    expect(opt.discountRequest.reason).toContain('The price has dropped since the owner approved this discount');
    expect(opt.discountRequest.reason).toContain(`approved at ${approvedPercent} %`);
    // Not applied until the owner decides again; the desk says why it waits.
    expect(opt.result.price.discountCents).toBe(0);
    expect(opt.pricing.discounts).toEqual([]);
    const desk = (await estimator.agent.get(`/api/jobs/${job.id}/desk`)).body;
    expect(waitsBecausePriceDropped(desk)).toBe(true);

    const again = await post(owner, `${url}/discount-decision`)
      .set('If-Match', `"${opt.version}"`)
      .send({ approve: true });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body.option.discountRequest).toMatchObject({ state: 'approved', percent: expectedPercent });
    expect(again.body.option.result.price.discountCents).toBe(amount);

    // A price that rises again leaves the approval standing (the share only falls).
    const dearer = await patch(estimator, url, again.body.option.version).send({ design: singleZone(rooms[0] ?? '') });
    expect(dearer.body.option.discountRequest.state).toBe('approved');
    expect(dearer.body.option.result.price.discountCents).toBe(amount);
  });
});

describe('every blocker calc names holds the ready mark', () => {
  it('a zone on no outdoor unit is refused with its reason', async () => {
    const { job, rooms } = await deskJob(estimator);
    const d = singleZone(rooms[0] ?? '');
    const design = {
      ...d,
      zones: [...d.zones, { key: 'z2', name: 'Office', roomIds: [rooms[2] ?? ''], indoorUnitKey: 'TSL-S9H-W' }],
    };
    await newOption(estimator, job.id, { name: 'Half done', design });
    const refused = await post(estimator, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: REASON } });
    expectProblem(refused, 422);
    expect(refused.body.blockers).toContainEqual(
      expect.objectContaining({
        code: 'combination-refused',
        message: 'Half done: Zone Office is not connected to any outdoor unit.',
      }),
    );
  });
});

describe('the ready mark follows the loads it was given on (issue 13)', () => {
  it('a room changed, added or removed, or the home’s facts changed, takes the mark off; a replay of the same values does not', async () => {
    const { job, rooms } = await deskJob(estimator);
    await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const markReady = async () => {
      const ok = await post(estimator, `/api/jobs/${job.id}/ready`).send({ sizingOverride: { reason: REASON } });
      expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    };
    const marked = async () => {
      const desk = (await estimator.agent.get(`/api/jobs/${job.id}/desk`)).body;
      const list = (await estimator.agent.get('/api/jobs?pageSize=100')).body.items as {
        id: string;
        readyToProposeAt: string | null;
      }[];
      const row = list.find((j) => j.id === job.id);
      // The jobs list and the desk always say the same.
      expect(row?.readyToProposeAt ?? null).toBe(desk.readiness.markedReady?.at ?? null);
      return desk.readiness.markedReady !== null;
    };
    const roomUrl = (id: string) => `/api/jobs/${job.id}/rooms/${id}`;
    const roomNow = async (id: string) =>
      (await estimator.agent.get(`/api/jobs/${job.id}/rooms`)).body.rooms.find((r: { id: string }) => r.id === id);

    await markReady();
    expect(await marked()).toBe(true);
    // The same values sent again (a phone's replay) change nothing the loads use: the mark stays.
    const living = await roomNow(rooms[0] ?? '');
    const same = await patch(estimator, roomUrl(living.id), living.version).send({ input: living.input });
    expect(same.status, JSON.stringify(same.body)).toBe(200);
    expect(await marked()).toBe(true);
    // A taller ceiling changes the room's loads: the office must look again.
    const taller = await patch(estimator, roomUrl(living.id), same.body.room.version).send({
      input: { ...living.input, ceilingHeightFt: 10 },
    });
    expect(taller.status, JSON.stringify(taller.body)).toBe(200);
    expect(await marked()).toBe(false);

    await markReady();
    const added = await newRoom(estimator, job.id, sampleRoom('Den'));
    expect(await marked()).toBe(false);

    await markReady();
    const removed = await del(estimator, roomUrl(added.id), added.version);
    expect(removed.status).toBe(204);
    expect(await marked()).toBe(false);

    await markReady();
    const current = (await estimator.agent.get(`/api/jobs/${job.id}`)).body.job;
    const leaky = await patch(estimator, `/api/jobs/${job.id}`, current.version).send({ tightness: 'leaky' });
    expect(leaky.status, JSON.stringify(leaky.body)).toBe(200);
    expect(await marked()).toBe(false);
  });
});

describe('an approved discount and a cheaper price book', () => {
  it('when the catalog cost drops with no write to the option, the desk no longer applies it and the owner decides again', async () => {
    const { job, rooms } = await deskJob(sales);
    const o = await newOption(sales, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = optionUrl(job.id, o.id);
    const amount = Math.round((o.result as { price: { sellCents: number } }).price.sellCents * 0.11);
    const asked = await patch(sales, url, o.version).send({
      pricing: { discounts: [{ label: 'Neighbour referral', kind: 'amount', value: amount }] },
    });
    const approved = await post(owner, `${url}/discount-decision`)
      .set('If-Match', `"${asked.body.option.version}"`)
      .send({ approve: true });
    expect(approved.body.option.discountRequest.state).toBe('approved');
    // The company's cost for the outdoor unit halves (a price-book change, not a desk write).
    const em = t.orm.em.fork();
    const row = await em.findOneOrFail(CompanyDataRowSchema, { company: a.id, dataset: 'models', key: 'TSL-S12H-O' });
    row.data = { ...row.data, costCents: Math.round(Number(row.data['costCents']) / 2) };
    await em.flush();
    const desk = (await estimator.agent.get(`/api/jobs/${job.id}/desk`)).body;
    const now = desk.options.find((x: { id: string }) => x.id === o.id);
    expect(now.result.price.discountCents).toBe(0);
    expect(waitsBecausePriceDropped(desk)).toBe(true);
    // The owner decides again from the same screen: approved at the new share, applied.
    const again = await post(owner, `${url}/discount-decision`)
      .set('If-Match', `"${now.version}"`)
      .send({ approve: true });
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body.option.discountRequest.state).toBe('approved');
    expect(again.body.option.discountRequest.percent).toBeGreaterThan(approved.body.option.discountRequest.percent);
    expect(again.body.option.result.price.discountCents).toBe(amount);
  });
});
