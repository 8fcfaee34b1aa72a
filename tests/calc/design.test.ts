import { describe, it, expect } from 'vitest';
import { computeDesign, computeOptions, CalcError, CAUTIONS, cylindersToBuy, stockKitLengthFt } from '@calc';
import { catalog, design, priceBook, pricing, threeRoomHome } from './sample-data';

const run = () => computeDesign({ home: threeRoomHome, design, catalog, priceBook, pricing });
const qty = (r: ReturnType<typeof run>, key: string) => r.takeoff.find((l) => l.itemKey === key)?.quantity;

describe('full design on the worked three-room house', () => {
  it('sizing: zone and system ratios with plain-word warnings', () => {
    const r = run();
    // Living zone = living + kitchen, met at their joint (coincident) peak hour: the largest hourly sum of
    // the two rooms' sensible gains, plus both latent gains (definition of a coincident load).
    const room = (id: string) => r.loads.rooms.find((x) => x.roomId === id)!;
    const living = room('living');
    const kitchenLoad = room('kitchen');
    const joint = living.hourlySensibleBtuh.map((v, i) => v + (kitchenLoad.hourlySensibleBtuh[i] ?? 0));
    const zoneLoad = Math.max(...joint) + living.latentGain.total + kitchenLoad.latentGain.total;
    expect(r.zones[0]?.sizing.coolingLoadBtuh).toBe(zoneLoad);
    expect(zoneLoad).toBeLessThan(living.coolingTotalBtuh + kitchenLoad.coolingTotalBtuh); // living peaks pm, kitchen am
    // GL-12K gives 12,000 at 95 °F: far above 130 % of this zone's load
    expect(r.zones[0]?.sizing.coolingRatio).toBeCloseTo(12000 / zoneLoad, 3);
    expect(r.zones[0]?.sizing.withinRange).toBe(false);
    expect(r.warnings.some((w) => w.includes('GL-12K wall head delivers'))).toBe(true);
    // System: 24,000 at 95 °F over the whole home's block load
    expect(r.systems[0]?.sizing.coolingRatio).toBeCloseTo(24000 / r.loads.totals.coolingBtuh, 3);
    expect(r.systems[0]?.combination.connectedPercent).toBe(88);
  });
  it('refrigerant: R-32 per-circuit pre-charge 25 ft at 0.16 oz/ft', () => {
    const ref = run().systems[0]?.refrigerant;
    // Reference §8: max(0, L − L_pre) × adder on the INSTALLED length (issue 9: a pre-flared kit's coiled surplus
    // holds refrigerant). 40 ft run → 50 ft kit: (50 − 25) × 0.16 = 4.0 oz; 20 ft → 25 ft kit → 0; system 60 + 4 = 64 oz
    // (1.814 kg < m1 1.842 kg). Was 2.4 oz when the charge used the run and the takeoff bought the 50 ft kit.
    expect(ref?.circuits.map((c) => c.extraChargeOz)).toEqual([4, 0]);
    expect(ref?.circuits.map((c) => c.coiledFt)).toEqual([10, 5]);
    expect(ref?.extraChargeOz).toBe(4);
    expect(ref?.totalChargeOz).toBe(64);
    expect(ref?.circuits[0]?.adderSource).toBe('equipment');
    expect(ref?.safetyClass).toBe('A2L');
    expect(ref?.cautions).toContain(CAUTIONS.a2l);
  });
  it('electrical: MCA 18.6 / MOCP 30 on NM-B → 12 AWG, 30 A breaker', () => {
    const e = run().systems[0]?.electrical;
    expect(e?.wireAwg).toBe(12);
    expect(e?.breakerA).toBe(30);
    expect(e?.disconnectWithinSight).toBe(true);
  });
  it('takeoff quantities with their derivations', () => {
    const r = run();
    expect(qty(r, 'line-set-kit:1/4x3/8:50ft')).toBe(1); // 40 ft → 50 ft kit
    expect(qty(r, 'line-set-kit:1/4x3/8:25ft')).toBe(1); // 20 ft → 25 ft kit
    expect(qty(r, 'comm-cable:14-4')).toBe(70); // (40 + 5) + (20 + 5) = 45 + 25
    expect(qty(r, 'line-cover:straight')).toBe(2); // 12 ft ÷ 8 ft → 2
    expect(qty(r, 'condensate-line:3/4')).toBe(30); // 15 → 20, 8 → 10
    expect(qty(r, 'condensate-pump')).toBe(1);
    expect(qty(r, 'wire:nm-b:12awg')).toBe(50); // one cable: (42 + 2 × 1.5) × 1.1 = 49.5 → 50 (common practice)
    expect(qty(r, 'refrigerant:R-32')).toBe(0.25); // 4.0 oz ÷ 16 oz/lb, priced by the pound used (issue 9)
    expect(qty(r, 'labor:run-line-set')).toBe(2.7); // (0.75 + 0.8) + (0.75 + 0.4)
    expect(qty(r, 'labor:electrical')).toBe(2.84); // 2 + 42 × 0.02
    for (const l of r.takeoff) {
      expect(l.derivation.length).toBeGreaterThan(0);
      expect(l.quantity).toBeGreaterThan(0);
    }
  });
  it('price: every step to the cent', () => {
    const p = run().price;
    // Equipment 210,000 + 52,000 + 46,000 = 308,000; materials 81,825 (sum of the price-book lines; refrigerant is
    // 0.25 lb × 1,100 = 275 since it is priced by the pound used, no longer an 18,000 cylinder); labor 16.64 h × 9,500 = 158,080
    expect(p.equipmentCostCents).toBe(308000);
    expect(p.materialsCostCents).toBe(81825);
    expect(p.laborCostCents).toBe(158080);
    // Goods 389,825 / 0.6 = 649,708.33 → 649,708; labor 158,080 / 0.6 = 263,466.67 → 263,467; sell 913,175; − 25,000 = 888,175
    expect(p.sellCents).toBe(913175);
    expect(p.subtotalCents).toBe(888175);
    // Taxable goods share 649,708 × 888,175 / 913,175 = 631,920.94 → 631,921; 6 % = 37,915.26 → 37,915; total 926,090
    expect(p.taxCents).toBe(37915);
    expect(p.totalCents).toBe(926090);
    // Deposit 30 % = 277,827; balance 648,263; 9.99 % / 60 months [PUB: annuity formula] → 13,770.48 → 13,770
    expect(p.depositCents).toBe(277827);
    expect(p.monthlyPaymentCents).toBe(13770);
  });
  it('cautions always include estimate, refrigerant, pressure test and electrician wording', () => {
    const r = run();
    expect(r.cautions).toEqual(
      expect.arrayContaining([
        CAUTIONS.estimate,
        CAUTIONS.refrigerant,
        CAUTIONS.pressureTest,
        CAUTIONS.electrical,
        CAUTIONS.a2l,
      ]),
    );
    expect(r.isEstimate).toBe(true);
  });
  it('unknown rooms and equipment are calc errors with a path', () => {
    const bad = { ...design, zones: [{ key: 'z', name: 'Z', roomIds: ['nope'], indoorUnitKey: 'GL-9K-WH' }] };
    expect(() => computeDesign({ home: threeRoomHome, design: bad, catalog, priceBook, pricing })).toThrow(CalcError);
    const [first] = design.systems;
    if (!first) throw new Error('sample design has a system');
    try {
      computeDesign({
        home: threeRoomHome,
        design: { ...design, systems: [{ ...first, outdoorUnitKey: 'missing' }] },
        catalog,
        priceBook,
        pricing,
      });
      expect.unreachable();
    } catch (e) {
      expect(e instanceof CalcError && e.code).toBe('UNKNOWN_EQUIPMENT');
      expect(e instanceof CalcError && e.details[0]?.path).toEqual(['systems', 0, 'outdoorUnitKey']);
    }
  });
  it('missing adder → labelled tube-volume estimate; missing price → warning', () => {
    const single = {
      zones: [{ key: 'z1', name: 'Bed', roomIds: ['bed'], indoorUnitKey: 'GL-12K-WH' }],
      systems: [
        {
          key: 's',
          name: 'Bedroom system',
          outdoorUnitKey: 'GL-O12-S1',
          circuits: [{ zoneKey: 'z1', lengthFt: 35 }],
          electrical: { circuitLengthFt: 30 },
        },
      ],
    };
    const r = computeDesign({ home: threeRoomHome, design: single, catalog, priceBook, pricing });
    const ref = r.systems[0]?.refrigerant;
    // R-410A 1/4 liquid at 61.76 lb/ft³: 0.195 oz/ft × (35 − 25) = 1.95 oz
    expect(ref?.circuits[0]?.adderSource).toBe('estimate');
    expect(ref?.extraChargeOz).toBeCloseTo(1.9, 1);
    expect(ref?.notes.some((n) => n.startsWith('Estimate'))).toBe(true);
    expect(r.warnings.some((w) => w.includes('No price for'))).toBe(true);
  });
  it('options side by side', () => {
    const o = computeOptions({
      home: threeRoomHome,
      catalog,
      priceBook,
      options: [
        { key: 'good', name: 'Good', design, pricing: { ...pricing, percent: 30 } },
        { key: 'best', name: 'Best', design, pricing },
      ],
    });
    expect(o.comparison).toHaveLength(2);
    expect(o.comparison[1]?.differenceFromFirstCents).toBe(
      (o.results[1]?.result.price.totalCents ?? 0) - (o.results[0]?.result.price.totalCents ?? 0),
    );
  });
  it('helpers: stock kits and cylinders', () => {
    // common practice [TRADE] stock lengths 15/25/35/50/75/100 ft
    expect(stockKitLengthFt({ lengthFt: 15 })).toBe(15);
    expect(stockKitLengthFt({ lengthFt: 101 })).toBeNull();
    expect(cylindersToBuy({ extraOz: 0, cylinderLb: 25 })).toBe(0);
    expect(cylindersToBuy({ extraOz: 401, cylinderLb: 25 })).toBe(2);
  });
});
