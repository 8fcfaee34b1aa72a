import { describe, it, expect } from 'vitest';
import {
  refrigerantPlan,
  outdoorUnitSchema,
  indoorUnitSchema,
  circuitSchema,
  homeLoad,
  roomFromMetric,
  designConditionsFromMetric,
  roomInputSchema,
} from '@calc';
import { catalog, conditions, threeRoomHome, bedroom } from './sample-data';

describe('A2L room-area estimate inside the refrigerant plan', () => {
  it('a charge above m1 in a small room warns with the estimated minimum area', () => {
    const base = catalog.outdoorUnits[0];
    const head = catalog.indoorUnits[0];
    if (!base || !head) throw new Error('sample catalog');
    const outdoor = outdoorUnitSchema.parse({ ...base, factoryChargeOz: 120 });
    const indoor = indoorUnitSchema.parse(head);
    const plan = refrigerantPlan({
      outdoor,
      circuits: [{ circuit: circuitSchema.parse({ zoneKey: 'z', lengthFt: 25 }), indoor, roomAreaM2: 5 }],
    });
    // [PUB: IEC 60335-2-40:2018 Annex GG room-area formula and m1 = 6 × LFL, reference §11; LFL 0.307 kg/m³ back-calculated there]
    // 120 oz = 3.402 kg > m1 1.842 kg; wall head h0 1.8 m: A_min = (3.402 / (2.5 × 0.307^1.25 × 1.8))² ≈ 10.9 m² > 5 m²
    expect(plan.notes.some((n) => n.includes('minimum room-area rules apply'))).toBe(true);
    // a room too small for the charge is a blocker now (the design cannot be marked ready), with its worked formula
    expect(plan.blockers.some((w) => w.includes('smaller than the estimated minimum 10.9 m²'))).toBe(true);
    expect(plan.explanations.find((e) => e.key === 'a2l:z')?.status).toBe('blocker');
  });
  it('R-410A is A1: no A2L caution', () => {
    // [PUB: ASHRAE 34 safety classes via CoolProp's designation table, reference §11]
    const o = catalog.outdoorUnits[1];
    const i = catalog.indoorUnits[1];
    if (!o || !i) throw new Error('sample catalog');
    const plan = refrigerantPlan({
      outdoor: outdoorUnitSchema.parse(o),
      circuits: [
        {
          circuit: circuitSchema.parse({ zoneKey: 'z', lengthFt: 30 }),
          indoor: indoorUnitSchema.parse(i),
          roomAreaM2: 20,
        },
      ],
    });
    expect(plan.safetyClass).toBe('A1');
    expect(plan.cautions.some((c) => c.includes('A2L'))).toBe(false);
  });
});

describe('edges', () => {
  it('outdoor humidity entered as grains gives the same load as the matching wet bulb', () => {
    // 98.456 gr is the W of 95/75 at sea level [PUB: psychrolib 1.1.1 GetHumRatioFromTWetBulb, reference check 1.4]
    const a = homeLoad({ home: threeRoomHome });
    const b = homeLoad({
      home: {
        ...threeRoomHome,
        designConditions: { ...conditions, outdoorCoolingWetBulbF: undefined, outdoorCoolingGrains: 98.456 },
      },
    });
    expect(Math.abs(a.totals.latentBtuh - b.totals.latentBtuh)).toBeLessThanOrEqual(2);
  });
  it('elevation lowers the air-stream loads by the altitude factor (5000 ft ≈ 0.832)', () => {
    // [PUB: ASHRAE Handbook—Fundamentals 2017 ch. 1 eq. 3 standard atmosphere, reference check 1.11: 12.228 psia, factor 0.8321]
    const sea = homeLoad({ home: threeRoomHome });
    const high = homeLoad({ home: { ...threeRoomHome, designConditions: { ...conditions, elevationFt: 5000 } } });
    expect(high.sensibleGain.infiltration / sea.sensibleGain.infiltration).toBeCloseTo(0.832, 2);
    expect(high.psychrometrics.altitudeFactor).toBeCloseTo(0.8321, 4);
  });
  it('metric edge converters: 3.6576 m = 12 ft, 91.44 cm = 36 in, 35 °C = 95 °F, 11.111 K = 20 °F', () => {
    // [PUB: SI/NIST exact definitions: 1 ft = 0.3048 m, 1 in = 2.54 cm; °F = °C × 9/5 + 32; a 1 K difference = 1.8 °F (reference §6, checks 6.12–6.13)]
    const metric = {
      ...bedroom,
      lengthFt: 3.6576,
      widthFt: 3.6576,
      ceilingHeightFt: 2.4384,
      exposedWalls: [
        {
          direction: 'N' as const,
          lengthFt: 3.6576,
          windows: [{ widthIn: 91.44, heightIn: 121.92, glazing: 'double-low-e' as const }],
        },
      ],
    };
    const room = roomInputSchema.parse(roomFromMetric(metric));
    expect(room.lengthFt).toBeCloseTo(12, 4);
    expect(room.ceilingHeightFt).toBeCloseTo(8, 4);
    expect(room.exposedWalls[0]?.windows[0]?.widthIn).toBeCloseTo(36, 3);
    const c = designConditionsFromMetric({
      outdoorCoolingDryBulbF: 35,
      outdoorCoolingWetBulbF: 23.889,
      outdoorHeatingDryBulbF: -12.222,
      dailyRangeF: 11.111,
    });
    expect(c.outdoorCoolingDryBulbF).toBeCloseTo(95, 6);
    expect(c.dailyRangeF).toBeCloseTo(20, 2);
  });
});
