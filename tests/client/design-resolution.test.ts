import { designConditionsSchema } from '@calc';
import { describe, expect, it } from 'vitest';
import { DESIGN_FIELDS, designSourcesOf, enteredOf, notesOf, resolveDesign } from '@contract';
import { overlayJob } from '../../client/src/features/walkthrough/sync/overlay';
import { designConditions, JOB_ID, jobRecord } from './helpers/walkthrough-harness';

/**
 * Design-condition resolution is one function both ends run (the contract's resolveDesign): the values
 * the walk-through shows while offline are the ones the server then stores, source text included.
 */
const companyDefault = {
  ...designConditions,
  source: 'Company climate table',
  latitudeDeg: 36,
  designMonth: 7,
  clearSkyTauB: 0.45,
  clearSkyTauD: 2.2,
  clearSkySource: 'Station table, July',
  groundDesignF: 42,
};

describe('resolveDesign', () => {
  it('with nothing typed, every value and the source text come from the company default', () => {
    const r = resolveDesign({}, companyDefault);
    expect(r.conditions?.source).toBe('Company climate table');
    for (const f of DESIGN_FIELDS) if (f !== 'outdoorCoolingGrains') expect(r.origin[f]).toBe('company-default');
    expect(r.conditions?.clearSkySource).toBe('Station table, July');
  });

  it('τb and τd are one pair: typing one drops the company default of both and of their source', () => {
    const r = resolveDesign({ clearSkyTauB: 0.5 }, companyDefault);
    expect(r.origin.clearSkyTauB).toBe('entered');
    expect(r.origin.clearSkyTauD).toBe('standard-default');
    expect(r.conditions).toBeNull();
    expect(r.issues.some((i) => i.path === 'clearSkyTauD')).toBe(true);
    const both = resolveDesign({ clearSkyTauB: 0.5, clearSkyTauD: 2.4, clearSkySource: 'Entered' }, companyDefault);
    expect(both.conditions).toMatchObject({ clearSkyTauB: 0.5, clearSkyTauD: 2.4, clearSkySource: 'Entered' });
    // latitude outside −60…70 is refused with calc's message
    const far = resolveDesign({ latitudeDeg: 75 }, companyDefault);
    expect(far.issues).toEqual([{ path: 'latitudeDeg', message: 'Latitude must be between -60 and 70 °' }]);
  });

  it('a typed source text wins over the company default’s; blank falls back to it', () => {
    expect(resolveDesign({ source: 'County code table 3' }, companyDefault).conditions?.source).toBe(
      'County code table 3',
    );
    expect(resolveDesign({ source: '   ' }, companyDefault).conditions?.source).toBe('Company climate table');
  });

  it('typing the outdoor humidity in grains drops the default wet bulb (they are alternatives)', () => {
    const r = resolveDesign({ outdoorCoolingGrains: 100 }, companyDefault);
    expect(r.conditions?.outdoorCoolingWetBulbF).toBeUndefined();
    expect(r.origin.outdoorCoolingGrains).toBe('entered');
    expect(r.origin.outdoorCoolingWetBulbF).toBe('standard-default');
  });

  it('with no defaults, calc’s standard defaults fill what it has defaults for, and say so', () => {
    const typed = { outdoorCoolingDryBulbF: 95, outdoorCoolingWetBulbF: 75, outdoorHeatingDryBulbF: 20 };
    const r = resolveDesign(typed, null);
    // calc's own parse of the same three values is the reference for its defaults.
    expect(r.conditions).toEqual(designConditionsSchema.parse(typed));
    expect(r.origin.indoorCoolingF).toBe('standard-default');
    const sources = designSourcesOf(r.conditions!, r.origin, { indoorCoolingF: 'ACCA default' });
    expect(sources.indoorCoolingF).toEqual({ source: 'standard-default', note: 'ACCA default' });
    expect(sources.outdoorCoolingGrains).toBeUndefined();
  });

  it('calc’s refusal comes back as field issues, with the merged values still shown', () => {
    const r = resolveDesign({ indoorHeatingF: 10 }, companyDefault);
    expect(r.conditions).toBeNull();
    expect(r.shown.indoorHeatingF).toBe(10);
    expect(r.issues.map((i) => i.path)).toContain('indoorHeatingF');
  });

  it('enteredOf and notesOf read back only what the person typed and wrote', () => {
    const r = resolveDesign({ outdoorCoolingDryBulbF: 99 }, companyDefault);
    const sources = designSourcesOf(r.conditions!, r.origin, { outdoorCoolingDryBulbF: 'Measured', elevationFt: '' });
    // the source texts are read back as the job stores them (like `source`, the sky source rides along)
    expect(enteredOf(r.conditions, sources)).toEqual({
      outdoorCoolingDryBulbF: 99,
      source: 'Company climate table',
      clearSkySource: 'Station table, July',
    });
    expect(notesOf(sources)).toEqual({ outdoorCoolingDryBulbF: 'Measured' });
  });
});

describe('the walk-through overlay uses the same resolution', () => {
  it('a queued edit with no source text shows the company default’s source, as the server will store it', () => {
    const job = jobRecord({ designConditions: null, designSources: {} });
    const queued = {
      id: 'q1',
      seq: 1,
      target: `job:${JOB_ID}`,
      baseVersion: 2,
      queuedAt: '2026-01-01T00:00:00.000Z',
      payload: { kind: 'job-update' as const, jobId: JOB_ID, changes: { designConditions: { dailyRangeF: 18 } } },
    };
    const { job: shown } = overlayJob(job, [queued], companyDefault);
    expect(shown.designConditions).toEqual(resolveDesign({ dailyRangeF: 18 }, companyDefault).conditions);
    expect(shown.designConditions?.source).toBe('Company climate table');
    expect(shown.designSources.dailyRangeF?.source).toBe('entered');
    expect(shown.designSources.elevationFt?.source).toBe('company-default');
  });
});
