import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES } from '@contract';
import { CompanySettingsSchema } from '../../server/src/modules/company-settings/company-settings.entity';
import { browserAgent, HTTPS, login, type Session, makeCompany, type TestCompany } from '../helpers/fixtures';
import { buildTestApp, type TestApp } from '../helpers/test-app';
import { DESIGN, expectProblem } from './jobs-helpers';

/** The owner's design-defaults page writes through PUT /api/company/settings: bounds, roles, company scoping. */

const PATH = '/api/company/settings';
const SKY = {
  ...DESIGN,
  latitudeDeg: -33.9,
  designMonth: 1,
  clearSkyTauB: 0.38,
  clearSkyTauD: 2.4,
  clearSkySource: 'Invented station table, January',
  groundDesignF: 52,
  source: 'Invented county code table',
};

let t: TestApp;
let a: TestCompany;
let b: TestCompany;
let owner: Session;

const put = (s: Session, version: number, body: unknown) =>
  s.agent
    .put(PATH)
    .set('X-CSRF-Token', s.csrf)
    .set('If-Match', `"${version}"`)
    .send(body as object);

beforeAll(async () => {
  t = await buildTestApp();
  a = await makeCompany(t.orm.em.fork(), 'SettingsA');
  b = await makeCompany(t.orm.em.fork(), 'SettingsB');
  owner = await login(t.app, a.users.owner.email);
});
afterAll(async () => t.close());

describe('company design defaults', () => {
  it('refuses each value out of calc’s bounds on its field, and stores nothing', async () => {
    // Bounds and messages are calc's designConditionsSchema (calc/src/schemas/design-conditions.ts).
    const cases: Array<[Record<string, unknown>, string, string]> = [
      [{ latitudeDeg: 75 }, 'latitudeDeg', 'Latitude must be between -60 and 70 °'],
      [{ latitudeDeg: -61 }, 'latitudeDeg', 'Latitude must be between -60 and 70 °'],
      [{ designMonth: 13 }, 'designMonth', 'Design month must be between 1 and 12'],
      [{ designMonth: 6.5 }, 'designMonth', 'Design month must be a whole number'],
      [{ clearSkyTauB: 2 }, 'clearSkyTauB', 'Beam optical depth τb must be between 0.1 and 1.5'],
      [{ clearSkyTauD: 0.5 }, 'clearSkyTauD', 'Diffuse optical depth τd must be between 1 and 3.5'],
      [
        { clearSkyTauD: undefined },
        'clearSkyTauD',
        'Enter both optical depths (τb and τd) from the same climatic table, or neither',
      ],
      [{ groundDesignF: 90 }, 'groundDesignF', 'Design ground surface temperature must be between -40 and 80 °F'],
      [
        { outdoorCoolingDryBulbF: 140 },
        'outdoorCoolingDryBulbF',
        'Outdoor cooling dry bulb must be between 50 and 130 °F',
      ],
      [{ clearSkySource: 'x'.repeat(201) }, 'clearSkySource', 'Source must be at most 200 characters'],
    ];
    for (const [change, field, message] of cases) {
      const r = await put(owner, 0, { unitSystem: 'imperial', defaultDesignConditions: { ...SKY, ...change } });
      expectProblem(r, 400);
      expect(r.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(r.body.errors, JSON.stringify(change)).toContainEqual({
        path: `defaultDesignConditions.${field}`,
        message,
      });
    }
    expect(await t.orm.em.fork().count(CompanySettingsSchema, { company: a.id })).toBe(0);
  });

  it('only the owner may change them; every staff role reads them', async () => {
    const saved = await put(owner, 0, { unitSystem: 'imperial', defaultDesignConditions: SKY });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body.settings.defaultDesignConditions).toMatchObject(SKY);
    const version = Number(saved.body.settings.version);
    for (const role of ROLES.filter((r) => r !== 'owner')) {
      const s = await login(t.app, a.users[role].email);
      const r = await put(s, version, { unitSystem: 'metric', defaultDesignConditions: { ...SKY, latitudeDeg: 10 } });
      expectProblem(r, 403);
      const read = await s.agent.get(PATH);
      expect(read.status).toBe(200);
      expect(read.body.settings.defaultDesignConditions.latitudeDeg).toBe(-33.9);
    }
    expectProblem(await browserAgent(t.app).get(PATH).set(HTTPS), 401);
    const row = await t.orm.em.fork().findOneOrFail(CompanySettingsSchema, { company: a.id });
    expect(row.defaultDesignConditions?.latitudeDeg).toBe(-33.9);
    expect(row.defaultDesignConditions?.clearSkySource).toBe('Invented station table, January');
    expect(row.version).toBe(version);
  });

  it('each company has its own: company B neither sees nor changes company A’s', async () => {
    const otherOwner = await login(t.app, b.users.owner.email);
    const first = await otherOwner.agent.get(PATH);
    expect(first.body.settings).toMatchObject({ defaultDesignConditions: null, version: 0 });
    // A's version number sent by B's owner is B's row's version, not A's: B's first save is at 0.
    const bSaved = await put(otherOwner, 0, {
      unitSystem: 'metric',
      defaultDesignConditions: { ...DESIGN, latitudeDeg: 47.5, source: 'Company B table' },
    });
    expect(bSaved.status, JSON.stringify(bSaved.body)).toBe(200);
    const aRead = await owner.agent.get(PATH);
    expect(aRead.body.settings.defaultDesignConditions.latitudeDeg).toBe(-33.9);
    expect(aRead.body.settings.unitSystem).toBe('imperial');
    const smuggled = await put(otherOwner, Number(bSaved.body.settings.version), {
      unitSystem: 'metric',
      companyId: a.id,
      defaultDesignConditions: DESIGN,
    });
    expectProblem(smuggled, 400);
    expect((await owner.agent.get(PATH)).body.settings.defaultDesignConditions.source).toBe(
      'Invented county code table',
    );
  });
});
