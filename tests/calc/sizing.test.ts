import { describe, it, expect } from 'vitest';
import {
  sizingRatio,
  capacityAtOutdoorF,
  checkSizing,
  checkCombination,
  DEFAULT_SIZING_POLICY,
  outdoorUnitSchema,
  indoorUnitSchema,
  CALC_ERROR_MESSAGES,
} from '@calc';
import { catalog } from './sample-data';

const policy = DEFAULT_SIZING_POLICY;
const flat = (btuh: number) => ({ description: 'GL-test unit', cooling: [{ outdoorF: 95, btuh }] });

describe('sizing (reference §7)', () => {
  it('7.2: 30,000 load, single-speed 90–115 % → 27,000–34,500; 36,000 fails, 30,000 passes', () => {
    // from memory [MEM: ACCA Manual S 2nd ed. Table N2]
    const load = { sensibleBtuh: 24000, latentBtuh: 6000, heatingBtuh: 0 };
    expect(policy.cooling['ac-single-speed']).toEqual({ minPercent: 90, maxPercent: 115 });
    expect(
      checkSizing({
        unit: flat(36000),
        equipmentType: 'ac-single-speed',
        load,
        coolingDesignF: 95,
        heatingDesignF: 10,
        policy,
      }).withinRange,
    ).toBe(false);
    expect(
      checkSizing({
        unit: flat(30000),
        equipmentType: 'ac-single-speed',
        load,
        coolingDesignF: 95,
        heatingDesignF: 10,
        policy,
      }).withinRange,
    ).toBe(true);
    expect(
      checkSizing({
        unit: flat(34500),
        equipmentType: 'ac-single-speed',
        load,
        coolingDesignF: 95,
        heatingDesignF: 10,
        policy,
      }).withinRange,
    ).toBe(true);
    expect(
      checkSizing({
        unit: flat(26900),
        equipmentType: 'ac-single-speed',
        load,
        coolingDesignF: 95,
        heatingDesignF: 10,
        policy,
      }).withinRange,
    ).toBe(false);
    const over = checkSizing({
      unit: flat(36000),
      equipmentType: 'ac-single-speed',
      load,
      coolingDesignF: 95,
      heatingDesignF: 10,
      policy,
    });
    expect(over.coolingRatio).toBe(1.2);
    expect(over.warnings[0]).toContain('oversized');
  });
  it('7.3: variable-speed limit 130 % → 39,000; a 3-ton (36,000) passes', () => {
    // from memory [MEM: ACCA Manual S 2nd ed.]
    const load = { sensibleBtuh: 24000, latentBtuh: 6000, heatingBtuh: 0 };
    expect(
      checkSizing({
        unit: flat(36000),
        equipmentType: 'ac-variable-speed',
        load,
        coolingDesignF: 95,
        heatingDesignF: 10,
        policy,
      }).withinRange,
    ).toBe(true);
    expect(
      checkSizing({
        unit: flat(39001),
        equipmentType: 'ac-variable-speed',
        load,
        coolingDesignF: 95,
        heatingDesignF: 10,
        policy,
      }).withinRange,
    ).toBe(false);
  });
  it('sizingRatio = capacity ÷ load; zero load is an error', () => {
    expect(sizingRatio({ loadBtuh: 30000, capacityBtuh: 36000 })).toBeCloseTo(1.2, 12);
    expect(() => sizingRatio({ loadBtuh: 0, capacityBtuh: 1 })).toThrow(CALC_ERROR_MESSAGES.NOT_POSITIVE);
  });
  it('policy is configurable: a stricter company limit flips the verdict', () => {
    const strict = {
      ...policy,
      cooling: { ...policy.cooling, 'ac-variable-speed': { minPercent: 95, maxPercent: 110 } },
    };
    const load = { sensibleBtuh: 24000, latentBtuh: 6000, heatingBtuh: 0 };
    expect(
      checkSizing({
        unit: flat(36000),
        equipmentType: 'ac-variable-speed',
        load,
        coolingDesignF: 95,
        heatingDesignF: 10,
        policy: strict,
      }).withinRange,
    ).toBe(false);
  });
});

describe('capacity interpolation', () => {
  const points = [
    { outdoorF: 82, btuh: 25500 },
    { outdoorF: 95, btuh: 24000 },
    { outdoorF: 105, btuh: 22000 },
  ];
  it('interpolates linearly: 100 °F halfway between 95 and 105 → 23,000', () => {
    expect(capacityAtOutdoorF({ points, outdoorF: 100 })).toMatchObject({ btuh: 23000, extrapolated: false });
    expect(capacityAtOutdoorF({ points, outdoorF: 95 }).btuh).toBe(24000);
  });
  it('extends the nearest segment outside the data and flags it (issue 9: holding the last rating overstated capacity)', () => {
    // Straight line through the two nearest points [PUB: linear extrapolation]:
    // 22,000 + (115 − 105) × (22,000 − 24,000) / (105 − 95) = 20,000 Btu/h
    expect(capacityAtOutdoorF({ points, outdoorF: 115 })).toMatchObject({
      btuh: 20000,
      extrapolated: true,
      method: 'extended',
    });
    // 25,500 + (70 − 82) × (24,000 − 25,500) / (95 − 82) = 25,500 + 1,384.615… Btu/h
    expect(capacityAtOutdoorF({ points: [...points].reverse(), outdoorF: 70 }).btuh).toBeCloseTo(26884.615, 2);
    // one point: nothing to extend along, so it is held and flagged
    expect(capacityAtOutdoorF({ points: [{ outdoorF: 95, btuh: 12000 }], outdoorF: 100 })).toMatchObject({
      btuh: 12000,
      extrapolated: true,
      method: 'held',
    });
  });
  it('heat-pump heating below the heat loss warns about supplemental heat', () => {
    const indoor = indoorUnitSchema.parse(catalog.indoorUnits[0]);
    const r = checkSizing({
      unit: indoor,
      equipmentType: 'heat-pump-variable-speed',
      load: { sensibleBtuh: 7000, latentBtuh: 1000, heatingBtuh: 12000 },
      coolingDesignF: 95,
      heatingDesignF: 5,
      policy,
    });
    expect(r.heatingCapacityBtuh).toBe(8000);
    expect(r.warnings.some((w) => w.includes('supplemental heat'))).toBe(true);
  });
});

describe('multi-zone combination limits', () => {
  const outdoor = outdoorUnitSchema.parse(catalog.outdoorUnits[0]);
  const nine = indoorUnitSchema.parse(catalog.indoorUnits[0]);
  const twelve = indoorUnitSchema.parse(catalog.indoorUnits[1]);
  it('9k + 12k on a 24k three-port unit = 88 %, within 50–130 %', () => {
    const c = checkCombination({ outdoor, indoor: [nine, twelve] });
    expect(c.connectedPercent).toBe(88);
    expect(c.ok).toBe(true);
  });
  it('four heads on a three-port unit and 200 % connected both warn', () => {
    const c = checkCombination({ outdoor, indoor: [twelve, twelve, twelve, twelve] });
    expect(c.ok).toBe(false);
    expect(c.warnings).toHaveLength(2);
    expect(c.connectedPercent).toBe(200);
  });
});

describe('heat-pump allowance by climate and the latent check (issue 9)', () => {
  const unit = (sensibleHeatRatio?: number) => ({
    description: 'Test unit',
    cooling: [{ outdoorF: 95, btuh: 12000 }],
    heating: [{ outdoorF: 10, btuh: 14000 }],
    ...(sensibleHeatRatio === undefined ? {} : { sensibleHeatRatio }),
  });
  const run = (load: { sensibleBtuh: number; latentBtuh: number; heatingBtuh: number }, shr?: number) =>
    checkSizing({
      unit: unit(shr),
      equipmentType: 'heat-pump-single-speed',
      load,
      coolingDesignF: 95,
      heatingDesignF: 10,
      policy: DEFAULT_SIZING_POLICY,
    });

  it('a single-speed heat pump at 120 % passes where heating dominates (125 % allowance) and fails where cooling does (115 %) [MEM: Manual S limits, trade-facts §7; the dominance rule is ours]', () => {
    // 12,000 ÷ 10,000 = 1.20
    const cold = run({ sensibleBtuh: 8000, latentBtuh: 2000, heatingBtuh: 20000 });
    expect(cold.limitRule).toBe('heat-pump-heating-dominated');
    expect(cold.allowedPercent.max).toBe(125);
    expect(cold.withinRange).toBe(true);
    const hot = run({ sensibleBtuh: 8000, latentBtuh: 2000, heatingBtuh: 6000 });
    expect(hot.limitRule).toBe('heat-pump-cooling-limit');
    expect(hot.allowedPercent.max).toBe(115);
    expect(hot.withinRange).toBe(false);
    expect(hot.warnings.some((w) => w.includes('air-conditioner limit'))).toBe(true);
  });

  it('latent check: capacity × (1 − SHR) against the latent load — 12,000 × (1 − 0.80) = 2,400 < 3,000 warns; 0.70 → 3,600 passes [PUB: SHR definition]', () => {
    const dry = run({ sensibleBtuh: 8000, latentBtuh: 3000, heatingBtuh: 20000 }, 0.8);
    expect(dry.latentCapacityBtuh).toBe(2400);
    // load SHR 8,000 / 11,000 = 0.7273
    expect(dry.loadSensibleHeatRatio).toBe(0.727);
    expect(dry.warnings.some((w) => w.includes('latent capacity (2400 Btu/h'))).toBe(true);
    const ok = run({ sensibleBtuh: 8000, latentBtuh: 3000, heatingBtuh: 20000 }, 0.7);
    expect(ok.latentCapacityBtuh).toBe(3600);
    expect(ok.warnings.some((w) => w.includes('latent capacity'))).toBe(false);
  });
});
