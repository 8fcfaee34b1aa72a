import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designSchema, type DesignInput } from '@calc';
import { proposalSnapshot, type ProposalSnapshot } from '@contract';
import { login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { designAsCalcReadsIt } from '../../server/src/modules/desk/desk-design';
import { patch, post } from './jobs-helpers';
import { deskJob, multiZone, newOption, seedData, singleZone } from './desk-helpers';

/**
 * The desk's read/save mapping: an option saved back exactly as GET …/desk returned it changes nothing —
 * not the desk's answer, not the next proposal version. It did: a design stored without calc's defaults
 * (the first price's suggestion, a copy, the demo) came back without them; the desk's form parses it (the
 * defaults filled in) and saved that, so each line set's condensate run went from the snapshot's "absent =
 * 0 ft" to calc's 10 ft, though the takeoff had charged 10 ft of line all along (desk-design.ts).
 */
let t: TestApp;
let a: TestCompany;
let estimator: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'RoundTrip');
  await seedData(t.orm.em.fork(), a.id);
  estimator = await login(t.app, a.users.estimator.email);
});
afterAll(async () => t.close());

type DeskOption = { id: string; version: number; name: string; design: unknown; pricing: unknown } & Record<
  string,
  unknown
>;

const desk = async (jobId: string): Promise<DeskOption[]> => {
  const r = await estimator.agent.get(`/api/jobs/${jobId}/desk`);
  expect(r.status, r.text.slice(0, 300)).toBe(200);
  return r.body.options as DeskOption[];
};

const markReady = async (jobId: string) => {
  const r = await post(estimator, `/api/jobs/${jobId}/ready`).send({
    sizingOverride: { reason: 'The owners asked for these units; the sizing was explained to them.' },
  });
  expect(r.status, JSON.stringify(r.body)).toBe(200);
};
const issue = async (jobId: string): Promise<ProposalSnapshot> => {
  const r = await post(estimator, `/api/jobs/${jobId}/proposal/versions`).send();
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  const n = (r.body.proposal.versions as { number: number; current: boolean }[]).find((v) => v.current)?.number;
  return proposalSnapshot.parse((await estimator.agent.get(`/api/jobs/${jobId}/proposal/versions/${n}`)).body.snapshot);
};

describe('GET …/desk → PATCH as returned → GET …/desk', () => {
  it('changes nothing, for a design stored by the form, by the first price (calc’s suggestion) and by a copy', async () => {
    const { job, rooms } = await deskJob(estimator);
    // 1: through the desk's PATCH body (parsed, defaults filled); 2: the first price, stored as calc suggested it;
    // 3: a copy of the first price.
    await newOption(estimator, job.id, { name: 'Whole home', design: multiZone(rooms) });
    const first = await post(estimator, `/api/jobs/${job.id}/first-price`).send({ name: 'First price' });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const reviewed = await post(estimator, `/api/jobs/${job.id}/options/${first.body.option.id}/review`).set(
      'If-Match',
      `"${first.body.option.version}"`,
    );
    expect(reviewed.status, JSON.stringify(reviewed.body)).toBe(200);
    await newOption(estimator, job.id, { name: 'Copy of the first price', copyFromOptionId: first.body.option.id });
    await markReady(job.id);
    const v1 = await issue(job.id);

    const before = await desk(job.id);
    expect(before).toHaveLength(3);
    for (const o of before) {
      const saved = await patch(estimator, `/api/jobs/${job.id}/options/${o.id}`, o.version).send({
        name: o.name,
        design: o.design,
        pricing: o.pricing,
      });
      expect(saved.status, JSON.stringify(saved.body)).toBe(200);
      // Nothing asked for changed: no new version (the job keeps its ready mark; desk.service.ts sameInputs).
      expect(saved.body.option.version, o.name).toBe(o.version);
      expect(saved.body.option.design, o.name).toEqual(o.design);
    }
    const after = await desk(job.id);
    expect(after).toEqual(before);

    // The next version is the same proposal: no change to list, every option's figures and line sets as before.
    const v2 = await issue(job.id);
    const diff = await estimator.agent.get(`/api/jobs/${job.id}/proposal/versions/1/diff/2`);
    expect(diff.status).toBe(200);
    expect(diff.body.changes).toEqual([]);
    expect(v2.options).toEqual(v1.options);

    // The condensate run the proposal prints is the run the takeoff priced: each option's condensate line
    // (build.ts: each circuit's run rounded up to the 10 ft the line is sold by) is the sum of the printed runs.
    for (const o of v2.options) {
      const runs = o.systems.flatMap((s) => s.lineSets.map((l) => l.condensate.lengthFt));
      expect(runs.length).toBeGreaterThan(0);
      const line = o.takeoff.filter((l) => l.itemKey === 'condensate-line:3/4');
      expect(
        line.reduce((sum, l) => sum + l.quantity, 0),
        o.name,
      ).toBe(runs.reduce((sum, ft) => sum + Math.ceil(ft / 10) * 10, 0));
    }
  }, 120_000);

  it('a design saved without its defaults comes back with them, as calc works it out', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Pair', design: singleZone(rooms[0] ?? '', 30) });
    const [read] = await desk(job.id);
    const circuit = (read?.design as DesignInput).systems[0]?.circuits[0];
    // calc's circuit defaults (calc/src/schemas/design.ts): a gravity drain with a 10 ft line, one wall
    // penetration, no line cover, no lift.
    expect(circuit).toEqual({
      zoneKey: 'z1',
      lengthFt: 30,
      liftFt: 0,
      wallPenetrations: 1,
      lineCoverFt: 0,
      condensate: 'gravity',
      condensateLengthFt: 10,
    });
    expect(read?.id).toBe(o.id);
  });
});

/** A circuit with each optional input present or absent, as a person or calc's suggestion may store it. */
const circuitArb = (zoneKey: string) =>
  fc.record(
    {
      zoneKey: fc.constant(zoneKey),
      lengthFt: fc.integer({ min: 1, max: 300 }),
      liftFt: fc.integer({ min: 0, max: 200 }),
      liftDirection: fc.constantFrom('indoor-above' as const, 'indoor-below' as const),
      lineSet: fc.constantFrom('kit' as const, 'field-cut' as const),
      wallPenetrations: fc.integer({ min: 0, max: 6 }),
      lineCoverFt: fc.integer({ min: 0, max: 300 }),
      condensate: fc.constantFrom('gravity' as const, 'pump' as const),
      condensateLengthFt: fc.integer({ min: 0, max: 200 }),
    },
    { requiredKeys: ['zoneKey', 'lengthFt'] },
  );

const designArb: fc.Arbitrary<DesignInput> = fc
  .tuple(
    fc.array(circuitArb('z1'), { minLength: 1, maxLength: 1 }),
    fc.option(fc.integer({ min: 0, max: 500 }), { nil: undefined }),
    fc.option(fc.boolean(), { nil: undefined }),
  )
  .map(([circuits, disconnectDistanceFt, disconnectVisible]) => ({
    zones: [{ key: 'z1', name: 'Living', roomIds: ['room-1'], indoorUnitKey: 'TSL-S12H-W' }],
    systems: [
      {
        key: 's1',
        name: 'Living system',
        outdoorUnitKey: 'TSL-S12H-O',
        circuits,
        electrical: {
          circuitLengthFt: 40,
          ...(disconnectDistanceFt === undefined ? {} : { disconnectDistanceFt }),
          ...(disconnectVisible === undefined ? {} : { disconnectVisible }),
        },
      },
    ],
  }));

describe('designAsCalcReadsIt (property)', () => {
  it('is a fixed point after one step, survives JSON (the wire and jsonb), and keeps every value given', () => {
    fc.assert(
      fc.property(designArb, (raw) => {
        const once = designAsCalcReadsIt(raw);
        expect(designAsCalcReadsIt(once)).toEqual(once);
        expect(JSON.parse(JSON.stringify(once))).toEqual(once);
        // The PATCH body's own parse of what the GET returned stores exactly that.
        expect(designSchema.parse(JSON.parse(JSON.stringify(once)))).toEqual(once);
        const given = raw.systems[0]?.circuits[0] ?? {};
        expect(once.systems[0]?.circuits[0]).toMatchObject(given);
      }),
      { numRuns: 200 },
    );
  });

  it('leaves a design calc cannot read as it was stored (calc reports why; the estimator sees what was saved)', () => {
    const broken = { zones: [], systems: [{ key: 's1' }] } as unknown as DesignInput;
    expect(designAsCalcReadsIt(broken)).toBe(broken);
  });
});
