import { computeDesign, priceOption, pricingSchema } from '@calc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserAgent, HTTPS, login, makeCompany, type Session, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { loadCompanyDesk } from '../../server/src/modules/desk/desk-inputs';
import { engineData } from '../../server/src/modules/desk/desk-compute';
import { del, expectProblem, patch, post } from './jobs-helpers';
import { BASE, put } from './company-data-helpers';
import { deskJob, multiZone, newOption, seedData, singleZone } from './desk-helpers';

let t: TestApp;
let a: TestCompany;
let owner: Session;
let estimator: Session;
let sales: Session;

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'DeskA');
  await seedData(t.orm.em.fork(), a.id);
  owner = await login(t.app, a.users.owner.email);
  estimator = await login(t.app, a.users.estimator.email);
  sales = await login(t.app, a.users.salesperson.email);
});
afterAll(async () => t.close());

describe('options: create, read, update, delete', () => {
  it('creates up to three options, moves the job to design, copies one, and refuses a fourth', async () => {
    const { job, rooms } = await deskJob(sales);
    const first = await newOption(sales, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    expect(first.position).toBe(1);
    const j = await sales.agent.get(`/api/jobs/${job.id}`);
    expect(j.body.job.status).toBe('design');
    const copy = await newOption(estimator, job.id, { name: 'Quiet comfort', copyFromOptionId: first.id });
    expect(copy.design).toEqual(first.design);
    await newOption(estimator, job.id, { name: 'Whole-home', design: multiZone(rooms) });
    expectProblem(await post(estimator, `/api/jobs/${job.id}/options`).send({ name: 'Fourth' }), 409);
    const desk = await estimator.agent.get(`/api/jobs/${job.id}/desk`);
    expect(desk.status).toBe(200);
    expect(desk.body.options.map((o: { name: string }) => o.name)).toEqual([
      'Essential',
      'Quiet comfort',
      'Whole-home',
    ]);
    for (const o of desk.body.options) expect(o.result.price.totalCents).toBeGreaterThan(0);
  });

  it('PATCH needs If-Match; a stale one is 409 with the option now; DELETE removes it', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    expectProblem(await patch(estimator, url).send({ name: 'Renamed' }), 428);
    const ok = await patch(estimator, url, o.version).send({ name: 'Renamed' });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.headers.etag).toBe(`"${ok.body.option.version}"`);
    const stale = await patch(estimator, url, o.version).send({ name: 'Again' });
    expectProblem(stale, 409);
    expect(stale.body.current.name).toBe('Renamed');
    expectProblem(await del(estimator, url, o.version), 409);
    expect((await del(estimator, url, ok.body.option.version)).status).toBe(204);
    expectProblem(await estimator.agent.get(url), 404);
  });
});

describe('bad input: problem+json with field paths, nothing stored', () => {
  it('refuses a bad design field, an unknown model and an unknown room', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const long = await patch(estimator, url, o.version).send({ design: singleZone(rooms[0] ?? '', 999) });
    expectProblem(long, 400);
    expect(long.body.errors).toContainEqual({
      path: 'design.systems.0.circuits.0.lengthFt',
      message: 'Line-set length must be between 1 and 300 ft',
    });
    const design = singleZone(rooms[0] ?? '');
    design.zones[0] = { ...design.zones[0], indoorUnitKey: 'NO-SUCH-MODEL' } as (typeof design.zones)[0];
    const unknown = await patch(estimator, url, o.version).send({ design });
    expectProblem(unknown, 400);
    expect(unknown.body.errors[0].path).toBe('design.zones.0.indoorUnitKey');
    const kit = singleZone(rooms[0] ?? '');
    const noKit = await patch(estimator, url, o.version).send({
      design: { ...kit, systems: [{ ...kit.systems[0], heatKitKey: 'NO-SUCH-KIT' }] },
    });
    expectProblem(noKit, 400);
    expect(noKit.body.errors[0].path).toBe('design.systems.0.heatKitKey');
    const ducted = singleZone(rooms[0] ?? '');
    const sys = ducted.systems[0];
    const twoDucted = await patch(estimator, url, o.version).send({
      design: {
        ...ducted,
        systems: [
          { ...sys, ducts: { location: 'attic' } },
          { ...sys, key: 'sys-2', name: 'Second', ducts: { location: 'bathtub' } },
        ],
      },
    });
    expectProblem(twoDucted, 400);
    expect(twoDucted.body.errors).toContainEqual({
      path: 'design.systems.1.ducts.location',
      message: 'Choose where the ducts run',
    });
    const twoValid = await patch(estimator, url, o.version).send({
      design: {
        ...ducted,
        systems: [
          { ...sys, ducts: { location: 'attic' } },
          { ...sys, key: 'sys-2', name: 'Second', ducts: { location: 'garage' } },
        ],
      },
    });
    // The same room on both systems' ducts: it would take two systems' duct loads.
    expectProblem(twoValid, 400);
    expect(twoValid.body.errors).toContainEqual({
      path: 'design.systems.1.ducts',
      message: `Room "${rooms[0]}" is already served by the ducts of Living system: a room is on one ducted system's ducts`,
    });
    const ghost = singleZone('00000000-0000-4000-8000-000000000000');
    const noRoom = await patch(estimator, url, o.version).send({ design: ghost });
    expectProblem(noRoom, 400);
    expect(noRoom.body.errors[0].path).toMatch(/^design\.zones\.0/);
    const now = await estimator.agent.get(url);
    expect(now.body.option.version).toBe(o.version);
    expect(now.body.option.design).toEqual(o.design);
  });

  it('refuses bad pricing fields with their paths and an unknown financing plan; nothing changes', async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const bad = await patch(estimator, url, o.version).send({
      pricing: { deposit: { kind: 'percent', value: 150 }, discounts: [{ label: '', kind: 'percent', value: 5 }] },
    });
    expectProblem(bad, 400);
    expect(bad.body.errors).toContainEqual({
      path: 'pricing.deposit.value',
      message: 'Deposit must be between 0 and 100 %',
    });
    expect(bad.body.errors.map((e: { path: string }) => e.path)).toContain('pricing.discounts.0.label');
    const plan = await patch(estimator, url, o.version).send({ pricing: { financingPlanKey: 'no-such-plan' } });
    expectProblem(plan, 400);
    expect(plan.body.errors[0].path).toBe('pricing.financingPlanKey');
    const now = await estimator.agent.get(url);
    expect(now.body.option.version).toBe(o.version);
    expect(now.body.option.pricing).toEqual(o.pricing);
  });

  it('ignores a total sent by the browser: the strict body refuses it and the stored figures are calc’s', async () => {
    const { job, rooms } = await deskJob(estimator);
    const r = await post(estimator, `/api/jobs/${job.id}/options`).send({
      name: 'Essential',
      design: singleZone(rooms[0] ?? ''),
      totalCents: 100,
    });
    expectProblem(r, 400);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const sneaky = await patch(estimator, url, o.version).send({
      pricing: { discounts: [], price: { totalCents: 1 } },
    });
    expectProblem(sneaky, 400);
    const read = await estimator.agent.get(url);
    expect(read.body.option.result.price.totalCents).toBeGreaterThan(100_000);
  });
});

describe('ducted systems', () => {
  it('a ducted system’s ducts are stored with the design and their loads explained on the system', async () => {
    const { job, rooms } = await deskJob(estimator);
    const plain = singleZone(rooms[0] ?? '');
    const o = await newOption(estimator, job.id, { name: 'Essential', design: plain });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const ducts = { location: 'attic', insulationR: 6, leakage: 'typical' };
    const r = await patch(estimator, url, o.version).send({
      design: { ...plain, systems: [{ ...plain.systems[0], ducts }] },
    });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.option.design.systems[0].ducts).toEqual(ducts);
    const why = r.body.option.result.systems[0].explanations.find((e: { key: string }) => e.key === 's1:ducts');
    expect(why.label).toMatch(/^Duct loads, .* \(ducts in the attic, R-6\)$/);
    // Attic ducts add gain to the rooms they serve (ASHRAE 152: attic air above the room in the afternoon).
    const load = (x: { body: { option: { result: { zones: { sizing: { coolingLoadBtuh: number } }[] } } } }) =>
      x.body.option.result.zones[0]?.sizing.coolingLoadBtuh ?? Number.NaN;
    expect(load(r)).toBeGreaterThan(load({ body: { option: o } as never }));
  });

  it('two ducted systems on different rooms (attic upstairs, basement downstairs): accepted, each with its own duct loads', async () => {
    const { job, rooms } = await deskJob(estimator);
    const up = singleZone(rooms[0] ?? '');
    const down = singleZone(rooms[1] ?? '');
    const plain = {
      zones: [...up.zones, { ...down.zones[0], key: 'z2', name: 'Bedroom' }],
      systems: [
        { ...up.systems[0], name: 'Upstairs' },
        { ...down.systems[0], key: 's2', name: 'Downstairs', circuits: [{ zoneKey: 'z2', lengthFt: 30 }] },
      ],
    };
    const o = await newOption(estimator, job.id, { name: 'Two storeys', design: plain });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const attic = { location: 'attic', insulationR: 6, leakage: 'typical' };
    const basement = { location: 'basement', insulationR: 4, leakage: 'leaky' };
    const [s1, s2] = plain.systems;
    const r = await patch(estimator, url, o.version).send({
      design: {
        ...plain,
        systems: [
          { ...s1, ducts: attic },
          { ...s2, ducts: basement },
        ],
      },
    });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.option.design.systems.map((s: { ducts: unknown }) => s.ducts)).toEqual([attic, basement]);
    type Why = { key: string; label: string; value: number };
    const whys = (i: number): Why[] =>
      r.body.option.result.systems[i].explanations.filter((e: Why) => e.key.endsWith(':ducts'));
    expect(whys(0).map((e) => e.label)).toEqual(['Duct loads, Upstairs (ducts in the attic, R-6)']);
    expect(whys(1).map((e) => e.label)).toEqual(['Duct loads, Downstairs (ducts in an unheated basement, R-4)']);
    // Each system's ducts add to its own room only (ASHRAE 152: the ducts' losses go to the rooms they serve).
    const before = o as unknown as { result: { zones: { sizing: { heatingLoadBtuh: number } }[] } };
    const heat = (zs: { sizing: { heatingLoadBtuh: number } }[], i: number) =>
      zs[i]?.sizing.heatingLoadBtuh ?? Number.NaN;
    for (const i of [0, 1]) expect(heat(r.body.option.result.zones, i)).toBeGreaterThan(heat(before.result.zones, i));
    const read = await estimator.agent.get(url);
    expect(read.body.option.result.systems[1].explanations.some((e: Why) => e.key === 's2:ducts')).toBe(true);
  });
});

describe('tested duct leakage (issue 13)', () => {
  it('stores the tested fractions with the test, works the loads with them, and refuses bad ones with their paths', async () => {
    const { job, rooms } = await deskJob(estimator);
    const plain = singleZone(rooms[0] ?? '');
    const o = await newOption(estimator, job.id, { name: 'Tested ducts', design: plain });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const withDucts = (ducts: Record<string, unknown>) => ({ ...plain, systems: [{ ...plain.systems[0], ducts }] });
    const base = { location: 'attic', insulationR: 6, leakage: 'typical' };
    const bad = await patch(estimator, url, o.version).send({
      design: withDucts({ ...base, supplyLeakageFraction: 0.7, returnLeakageFraction: 0.04 }),
    });
    expectProblem(bad, 400);
    expect(bad.body.errors).toEqual(
      expect.arrayContaining([
        {
          path: 'design.systems.0.ducts.supplyLeakageFraction',
          message: 'Supply duct leakage must be between 0 and 0.5',
        },
        {
          path: 'design.systems.0.ducts.leakageTest',
          message: 'Say when and how the ducts were tested (date and method)',
        },
      ]),
    );
    const unchanged = await t.orm.em.fork().execute(`select design from design_option where id = ?`, [o.id]);
    expect(unchanged[0]?.design.systems[0].ducts).toBeUndefined();
    const tested = {
      ...base,
      supplyLeakageFraction: 0.05,
      returnLeakageFraction: 0.03,
      leakageTest: '2026-11-20, blower test at 25 Pa',
    };
    const r = await patch(estimator, url, o.version).send({ design: withDucts(tested) });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.option.design.systems[0].ducts).toEqual(tested);
    const why = r.body.option.result.systems[0].explanations.find((e: { key: string }) => e.key === 's1:ducts');
    expect(why.text).toContain('supply 0.05 tested (2026-11-20, blower test at 25 Pa)');
    expect(why.inputs.find((i: { label: string }) => i.label === 'Supply leakage').value).toBe(0.05);
  });
});

describe('disconnects beyond a whip and the heat kit’s circuit (issue 13)', () => {
  it('a far disconnect gets a priced liquid-tight run and a warning; a bad distance is refused; the heat kit has its own', async () => {
    const { job, rooms } = await deskJob(estimator);
    const plain = singleZone(rooms[0] ?? '');
    const o = await newOption(estimator, job.id, { name: 'Far disconnect', design: plain });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const withElectrical = (electrical: Record<string, unknown>, extra: Record<string, unknown> = {}) => ({
      ...plain,
      systems: [{ ...plain.systems[0], ...extra, electrical: { ...plain.systems[0]?.electrical, ...electrical } }],
    });
    const bad = await patch(estimator, url, o.version).send({ design: withElectrical({ disconnectDistanceFt: 600 }) });
    expectProblem(bad, 400);
    expect(bad.body.errors.map((e: { path: string }) => e.path)).toContain(
      'design.systems.0.electrical.disconnectDistanceFt',
    );
    const stored = await t.orm.em.fork().execute(`select design from design_option where id = ?`, [o.id]);
    expect(stored[0]?.design.systems[0].electrical.disconnectDistanceFt).toBe(5); // unchanged: the default

    const far = await patch(estimator, url, o.version).send({ design: withElectrical({ disconnectDistanceFt: 20 }) });
    expect(far.status, JSON.stringify(far.body)).toBe(200);
    const r = far.body.option.result;
    const lines = r.takeoff as { itemKey: string; quantity: number; unitCostCents: number | null }[];
    const line = (k: string) => lines.find((l) => l.itemKey === k);
    // 20 ft + 2 × 1 ft → 25 ft of liquid-tight; (25 − 2) ÷ 4.5 → 6 spans → 7 supports [NEC 350.30(A)].
    expect(line('raceway:lfmc:1/2')).toMatchObject({ quantity: 25 });
    expect(line('raceway:lfmc:1/2')?.unitCostCents).not.toBeNull();
    expect(line('fitting:lfmc:1/2')?.quantity).toBe(2);
    expect(line('strap:lfmc:1/2')?.quantity).toBe(7);
    expect(lines.some((l) => l.itemKey.startsWith('whip:'))).toBe(false);
    expect(r.warnings.some((w: string) => w.includes('a 6 ft whip does not reach'))).toBe(true);
    expect(r.warnings.some((w: string) => w.startsWith('No price for'))).toBe(false);
    const e = r.systems[0].electrical;
    expect(e.explanations.find((x: { key: string }) => x.key === 's1:elec:disconnect-run').status).toBe('warning');
    expect(e.caution).toContain('licensed electrician');

    // A ducted system with a heat kit whose disconnect is out of sight of the air handler: it blocks "ready".
    const ducted = {
      zones: [{ key: 'z1', name: 'House', roomIds: rooms, indoorUnitKey: 'TSL-AH36' }],
      systems: [
        {
          key: 's1',
          name: 'Ducted',
          outdoorUnitKey: 'TSL-HP24',
          heatKitKey: 'TSL-HK5',
          circuits: [{ zoneKey: 'z1', lengthFt: 25 }],
          electrical: { circuitLengthFt: 40, heatKitDisconnectDistanceFt: 60 },
        },
      ],
    };
    const kit = await patch(estimator, url, far.body.option.version).send({ design: ducted });
    expect(kit.status, JSON.stringify(kit.body)).toBe(200);
    const k = kit.body.option.result.systems[0].heatKitElectrical;
    expect(k.disconnectRun).toMatchObject({ kind: 'field-run' });
    expect(
      kit.body.option.result.takeoff.find((l: { itemKey: string }) => l.itemKey === 'disconnect:60a').quantity,
    ).toBe(2);
    const ready = await post(estimator, `/api/jobs/${job.id}/ready`).send();
    expectProblem(ready, 422);
    expect(JSON.stringify(ready.body)).toContain('The disconnect must be within sight');
    // The heat kit's run from the panel, not entered: the outdoor unit's 40 ft is assumed and said so; a note,
    // not a reason to hold the ready mark.
    expect(k.circuitLengthFt).toBe(40);
    expect(k.warnings).toContain(k.circuitLengthAssumed);
    expect(JSON.stringify(ready.body)).not.toContain('Panel to air handler not entered');

    // Its own run: bounded like the outdoor unit's (1–300 ft), refused with the field's message and nothing stored.
    const withKitRun = (ft: number) => ({
      ...ducted,
      systems: [{ ...ducted.systems[0], electrical: { ...ducted.systems[0]?.electrical, heatKitCircuitLengthFt: ft } }],
    });
    const tooLong = await patch(estimator, url, kit.body.option.version).send({ design: withKitRun(301) });
    expectProblem(tooLong, 400);
    expect(tooLong.body.errors).toContainEqual({
      path: 'design.systems.0.electrical.heatKitCircuitLengthFt',
      message: 'Panel to air handler must be between 1 and 300 ft',
    });
    const kept = await t.orm.em.fork().execute(`select design from design_option where id = ?`, [o.id]);
    expect(kept[0]?.design.systems[0].electrical.heatKitCircuitLengthFt).toBeUndefined();
    const own = await patch(estimator, url, kit.body.option.version).send({ design: withKitRun(120) });
    expect(own.status, JSON.stringify(own.body)).toBe(200);
    const saved = await t.orm.em.fork().execute(`select design from design_option where id = ?`, [o.id]);
    expect(saved[0]?.design.systems[0].electrical.heatKitCircuitLengthFt).toBe(120);
    const ownKit = own.body.option.result.systems[0].heatKitElectrical;
    // 2 × 120 ft × 26.0 A × 1.24 Ω/1000 ft (10 AWG, NEC Ch. 9 Table 8, from memory) = 7.74 V = 3.22 % of 240 V.
    expect(ownKit).toMatchObject({ circuitLengthFt: 120, circuitLengthAssumed: null, voltageDropPercent: 3.22 });
    expect(own.body.option.result.systems[0].electrical.circuitLengthFt).toBe(40);

    // A heat kit the catalog lists for another air handler (the 10 kW kit: the 60k handler only) is refused, with
    // the reason, and holds the ready mark.
    const otherKit = { ...ducted, systems: [{ ...ducted.systems[0], heatKitKey: 'TSL-HK10' }] };
    const refused = await patch(estimator, url, own.body.option.version).send({ design: otherKit });
    expect(refused.status, JSON.stringify(refused.body)).toBe(200);
    const why = 'is installed in an air handler it is listed for (TSL-AH60): Ducted has none.';
    expect(refused.body.option.result.systems[0].combination.refusals.join(' ')).toContain(why);
    const notReady = await post(estimator, `/api/jobs/${job.id}/ready`).send();
    expectProblem(notReady, 422);
    expect(JSON.stringify(notReady.body)).toContain(why);
  });
});

describe('server totals equal calc’s', () => {
  /** calc's own answer for a design on the job, from the company's data as the server reads it now. */
  async function direct(
    jobId: string,
    design: Parameters<typeof computeDesign>[0]['design'],
    own?: { method: 'markup' | 'margin'; percent: number },
  ) {
    const data = engineData(await loadCompanyDesk(t.orm.em.fork(), a.id));
    const jobRow = await estimator.agent.get(`/api/jobs/${jobId}`);
    const roomRows = await estimator.agent.get(`/api/jobs/${jobId}/rooms`);
    const settings = data.desk.settings;
    const rule = own ?? settings.defaultSellRule;
    const pricing = pricingSchema.parse({
      method: rule.method,
      percent: rule.percent,
      // Issue 13: with no rule of its own an option sells each line at its price-book rule.
      sellRulesBy: own ? 'option' : 'line',
      taxRatePercent: settings.taxRatePercent,
      taxOn: settings.taxAppliesTo,
    });
    const result = computeDesign({
      home: {
        id: jobId,
        designConditions: jobRow.body.job.designConditions,
        tightness: jobRow.body.job.tightness,
        ...jobRow.body.job.house,
        rooms: roomRows.body.rooms.map((r: { input: unknown }) => r.input),
      },
      design,
      catalog: data.catalog,
      priceBook: data.priceBook,
      pricing,
    });
    return { result, pricing, data };
  }

  it('computes each option with calc from the saved inputs, each line at its price-book rule', async () => {
    // The salesperson's own job, so that they can read it too (below).
    const { job, rooms } = await deskJob(sales);
    const o = await newOption(estimator, job.id, { name: 'Whole-home', design: multiZone(rooms) });
    const { result, pricing, data } = await direct(job.id, multiZone(rooms));
    const read = await estimator.agent.get(`/api/jobs/${job.id}/options/${o.id}`);
    const price = read.body.option.result.price;
    expect(price.sellRulesBy).toBe('line');
    expect(price.totalCents).toBe(result.price.totalCents);
    expect(price.sellCents).toBe(result.price.sellCents);
    expect(price.costCents).toBe(result.price.costCents);
    expect(price.grossMarginPercent).toBe(result.price.grossMarginPercent);
    expect(priceOption({ lines: result.takeoff, pricing, priceBook: data.priceBook }).totalCents).toBe(
      price.totalCents,
    );
    expect(read.body.option.result.systems[0].refrigerant.extraChargeOz).toBe(
      result.systems[0]?.refrigerant.extraChargeOz,
    );
    // Each line carries calc's sell price and rule; the sums are the option's sell.
    const lines = read.body.option.result.takeoff as {
      itemKey: string;
      category: string;
      sellCents: number;
      sellRule: { source: string; from: string | null };
    }[];
    expect(lines.map((l) => l.sellCents)).toEqual(result.price.lineSells.map((l) => l.sellCents));
    expect(lines.reduce((sum, l) => sum + l.sellCents, 0)).toBe(price.sellCents);
    const outdoor = lines.find((l) => l.itemKey === 'equipment:TSL-M24-3P');
    expect(outdoor?.sellRule).toMatchObject({ source: 'category', from: 'Equipment' });
    const why = (read.body.option.result.explanations as { key: string; text: string }[]).find(
      (e) => e.key === 'sell:equipment:TSL-M24-3P',
    );
    expect(why?.text).toContain('category "Equipment"');
    // A salesperson sees neither the line's sell rule nor its why (they show our cost).
    const salesRead = await sales.agent.get(`/api/jobs/${job.id}/options/${o.id}`);
    expect(salesRead.status).toBe(200);
    const salesLines = salesRead.body.option.result.takeoff as Record<string, unknown>[];
    expect(salesLines.every((l) => !('sellRule' in l) && !('sellCents' in l))).toBe(true);
    expect(salesRead.body.option.result.explanations.some((e: { key: string }) => e.key.startsWith('sell:'))).toBe(
      false,
    );
  });

  it("a category's new rule reprices its lines on the next read; an option's own rule overrides every line", async () => {
    const { job, rooms } = await deskJob(estimator);
    const o = await newOption(estimator, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    const url = `/api/jobs/${job.id}/options/${o.id}`;
    const before = (await estimator.agent.get(url)).body.option.result;
    const category = (await owner.agent.get(`${BASE}/categories/equipment`)).body.row;
    const changed = await put(owner, `${BASE}/categories/equipment`, category.version).send({
      record: { ...category.record, sellRule: { method: 'markup', percent: 90 } },
    });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    try {
      const after = (await estimator.agent.get(url)).body.option.result;
      const eq = (r: typeof before) =>
        (r.takeoff as { itemKey: string; extendedCostCents: number; sellCents: number }[]).find(
          (l) => l.itemKey === 'equipment:TSL-S12H-O',
        );
      const cost = eq(after)?.extendedCostCents ?? 0;
      // markup 90 %: price = cost × 1.9, half-up to the cent [PUB: definition of markup]
      expect(eq(after)?.sellCents).toBe(Math.round(cost * 1.9));
      expect(eq(after)?.sellCents).not.toBe(eq(before)?.sellCents);
      const { result } = await direct(job.id, singleZone(rooms[0] ?? ''));
      expect(after.price.totalCents).toBe(result.price.totalCents);
      // The option's own rule: one rule for every line, as calc's 'option' mode.
      const current = (await estimator.agent.get(url)).body.option;
      const own = { method: 'margin' as const, percent: 30 };
      const patched = await patch(estimator, url, current.version).send({
        pricing: { ...current.pricing, sellRule: own },
      });
      expect(patched.status, JSON.stringify(patched.body)).toBe(200);
      const mine = patched.body.option.result;
      expect(mine.price.sellRulesBy).toBe('option');
      expect(mine.takeoff.every((l: { sellRule: { source: string } }) => l.sellRule.source === 'option')).toBe(true);
      expect(mine.price.totalCents).toBe(
        (await direct(job.id, singleZone(rooms[0] ?? ''), own)).result.price.totalCents,
      );
    } finally {
      const now = (await owner.agent.get(`${BASE}/categories/equipment`)).body.row;
      await put(owner, `${BASE}/categories/equipment`, now.version).send({ record: category.record });
    }
  });
});

describe("the price book's categories and labor tasks, line by line (issue 13)", () => {
  it('a non-taxable category stays out of the tax base and says so; a labor task gives its line its hours', async () => {
    const { job, rooms } = await deskJob(sales);
    const url = `/api/jobs/${job.id}`;
    const task = (await owner.agent.get(`${BASE}/labor/mount-wall-head`)).body.row;
    const changed = await put(owner, `${BASE}/labor/mount-wall-head`, task.version).send({
      record: { ...task.record, hoursPerUnit: 2.25 },
    });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    try {
      const o = await newOption(estimator, job.id, {
        name: 'Taxed whole',
        design: singleZone(rooms[0] ?? ''),
        pricing: { tax: { taxRatePercent: 8, taxOn: 'total', reason: 'County rule taxes the whole job' } },
      });
      const r = (await estimator.agent.get(`${url}/options/${o.id}`)).body.option.result;
      const lines = r.takeoff as {
        itemKey: string;
        category: string;
        sellCents: number;
        taxed: boolean;
        quantity: number;
        derivation: string;
      }[];
      // The demo's Labor category is not taxable: every labor line is out, everything else in.
      for (const l of lines) expect(l.taxed, l.itemKey).toBe(l.category !== 'labor');
      const taxedSell = lines.filter((l) => l.taxed).reduce((a, l) => a + l.sellCents, 0);
      // Tax on the taxed lines' share of the discounted price [definition; no discount here, so their sell].
      expect(r.price.taxableCents).toBe(Math.round((taxedSell * r.price.subtotalCents) / r.price.sellCents));
      expect(r.price.taxableCents).toBeLessThan(r.price.subtotalCents);
      const whys = r.explanations as { key: string; text: string }[];
      expect(whys.find((e) => e.key === 'tax:labor:set-outdoor')?.text).toContain('"Labor" is not taxable');
      expect(whys.find((e) => e.key === 'price:tax')?.text).toContain('lines of "Labor" are left out');
      // The task's 2.25 h per wall unit, named in the line's derivation.
      const mount = lines.find((l) => l.itemKey === 'labor:mount-indoor:wall-head');
      expect(mount?.quantity).toBe(2.25);
      expect(mount?.derivation).toContain('price-book task "Mount a wall unit"');
      // A salesperson sees the tax, not each line's treatment (it sits with the cost and rule).
      const salesRead = await sales.agent.get(`${url}/options/${o.id}`);
      expect(salesRead.status).toBe(200);
      const salesLines = salesRead.body.option.result.takeoff as Record<string, unknown>[];
      expect(salesLines.length).toBe(lines.length);
      expect(salesLines.every((l) => !('taxed' in l))).toBe(true);
      expect(salesRead.body.option.result.price.taxCents).toBe(r.price.taxCents);
    } finally {
      const now = (await owner.agent.get(`${BASE}/labor/mount-wall-head`)).body.row;
      await put(owner, `${BASE}/labor/mount-wall-head`, now.version).send({ record: task.record });
    }
  });
});

describe('refrigerant in the price book (issue 13)', () => {
  it('a row priced by the ounce in its category prices the extra charge by the ounce at the category rule', async () => {
    const row = (await owner.agent.get(`${BASE}/refrigerants/R-32`)).body.row;
    const missing = await put(owner, `${BASE}/refrigerants/R-32`, row.version).send({
      record: { key: 'R-32', costCentsPerOz: 70, category: 'no-such' },
    });
    expectProblem(missing, 400);
    expect(missing.body.errors).toEqual([
      { path: 'record.category', message: 'No category "no-such": add it under categories first' },
    ]);
    const both = await put(owner, `${BASE}/refrigerants/R-32`, row.version).send({
      record: { key: 'R-32', costCentsPerOz: 70, costCentsPerLb: 1100 },
    });
    expectProblem(both, 400);
    expect(JSON.stringify(both.body.errors)).toContain('Give the cost either per lb or per oz');
    const changed = await put(owner, `${BASE}/refrigerants/R-32`, row.version).send({
      record: { key: 'R-32', costCentsPerOz: 70, category: 'refrigerant' },
    });
    expect(changed.status, JSON.stringify(changed.body)).toBe(200);
    try {
      const { job, rooms } = await deskJob(estimator);
      const o = await newOption(estimator, job.id, { name: 'Long run', design: singleZone(rooms[0] ?? '', 60) });
      const r = (await estimator.agent.get(`/api/jobs/${job.id}/options/${o.id}`)).body.option.result;
      const extraOz = r.systems[0].refrigerant.extraChargeOz as number;
      expect(extraOz).toBeGreaterThan(0);
      const gas = (r.takeoff as Record<string, unknown>[]).find((l) => l['itemKey'] === 'refrigerant:R-32');
      // By the ounce: the extra charge itself, at 70 ¢/oz; the demo's Refrigerant category's markup 80 %.
      expect(gas).toMatchObject({ unit: 'oz', quantity: extraOz, unitCostCents: 70 });
      expect(gas?.['extendedCostCents']).toBe(Math.round(extraOz * 70));
      expect(gas?.['sellRule']).toMatchObject({
        method: 'markup',
        percent: 80,
        source: 'category',
        from: 'Refrigerant',
      });
    } finally {
      const now = (await owner.agent.get(`${BASE}/refrigerants/R-32`)).body.row;
      await put(owner, `${BASE}/refrigerants/R-32`, now.version).send({ record: row.record });
    }
  });
});

describe('scoping', () => {
  it('401 signed out, 404 for another company, another salesperson’s job and an unassigned installer', async () => {
    const { job, rooms } = await deskJob(owner);
    const o = await newOption(owner, job.id, { name: 'Essential', design: singleZone(rooms[0] ?? '') });
    expectProblem(await browserAgent(t.app).get(`/api/jobs/${job.id}/desk`).set(HTTPS), 401);
    const b = await makeCompany(t.orm.em.fork(), 'DeskB');
    const bOwner = await login(t.app, b.users.owner.email);
    expectProblem(await bOwner.agent.get(`/api/jobs/${job.id}/desk`), 404);
    expectProblem(await bOwner.agent.get(`/api/jobs/${job.id}/options/${o.id}`), 404);
    expectProblem(await patch(bOwner, `/api/jobs/${job.id}/options/${o.id}`, o.version).send({ name: 'x' }), 404);
    expectProblem(await sales.agent.get(`/api/jobs/${job.id}/desk`), 404);
    const installer = await login(t.app, a.users.installer.email);
    expectProblem(await installer.agent.get(`/api/jobs/${job.id}/desk`), 404);
  });
});
