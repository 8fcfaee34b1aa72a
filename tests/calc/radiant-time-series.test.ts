import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  designDayContext,
  FACINGS,
  homeInputSchema,
  homeLoad,
  homeLoadFromParsed,
  houseSchema,
  liveHome,
  NONSOLAR_RTS_PERCENT,
  radiantTimeSeries,
  RADIANT_FRACTION,
  RTS_CONSTRUCTIONS,
  rtsFractions,
  SOLAR_RTS_PERCENT,
  windowConductionRadiantFraction,
} from '@calc';
import { conditions } from './sample-data';
import { ranchHome } from './ranch-home';

/*
 * The radiant time series (RTS) of ASHRAE Handbook—Fundamentals ch. 18 (Spitler, Fisher and Pedersen,
 * ASHRAE Transactions 103(2), 1997). Its definition: the radiant part of each hour's heat gain reaches
 * the cooling load over the next 24 hours in the proportions r_0 … r_23 of the radiant time factors,
 * which add up to 1; over a design day that repeats, the day's cooling load therefore equals the day's
 * heat gain (no energy is lost or made, it is only moved in time).
 */
const sum = (xs: ArrayLike<number>): number => Array.from(xs).reduce((a, b) => a + b, 0);
const day = fc.array(fc.double({ min: -5000, max: 20000, noNaN: true }), { minLength: 24, maxLength: 24 });

describe('the published radiant time factors', () => {
  it.each(RTS_CONSTRUCTIONS)('%s construction: the 24 solar and the 24 nonsolar factors each sum to 100 %%', (c) => {
    // [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 18 Tables 19 and 20: each column is a whole day's response]
    expect(SOLAR_RTS_PERCENT[c]).toHaveLength(24);
    expect(NONSOLAR_RTS_PERCENT[c]).toHaveLength(24);
    expect(sum(SOLAR_RTS_PERCENT[c])).toBe(100);
    expect(sum(NONSOLAR_RTS_PERCENT[c])).toBe(100);
    for (const r of [...SOLAR_RTS_PERCENT[c], ...NONSOLAR_RTS_PERCENT[c]]) expect(r).toBeGreaterThanOrEqual(0);
  });

  it('heavier rooms give less of a gain back in the hour it arrives and more in later hours', () => {
    // [PUB: the tables' first factor falls light → medium → heavy, the mass stores more; Tables 19 and 20]
    expect(SOLAR_RTS_PERCENT.light[0]!).toBeGreaterThan(SOLAR_RTS_PERCENT.medium[0]!);
    expect(SOLAR_RTS_PERCENT.medium[0]!).toBeGreaterThan(SOLAR_RTS_PERCENT.heavy[0]!);
    expect(NONSOLAR_RTS_PERCENT.light[0]!).toBeGreaterThan(NONSOLAR_RTS_PERCENT.medium[0]!);
    expect(NONSOLAR_RTS_PERCENT.medium[0]!).toBeGreaterThan(NONSOLAR_RTS_PERCENT.heavy[0]!);
  });

  it('the radiative splits are those of the handbook’s Table 14', () => {
    // [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 18 Table 14: walls and floors 0.46, roof 0.60, windows 0.33
    // (SHGC > 0.5) or 0.46 (SHGC < 0.5), transmitted sun with no interior shading 1.0]
    expect(RADIANT_FRACTION).toMatchObject({ wallsAndFloors: 0.46, roof: 0.6, sunUnshaded: 1 });
    expect(windowConductionRadiantFraction(0.67)).toBe(0.33);
    expect(windowConductionRadiantFraction(0.3)).toBe(0.46);
  });
});

describe('the radiant time series over a repeating design day', () => {
  it('property: the day’s cooling load equals the day’s heat gain, for any gain, split and class', () => {
    // [PUB: the method's definition — factors summing to 1 over a periodic day conserve the day's energy]
    fc.assert(
      fc.property(
        day,
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.constantFrom(...RTS_CONSTRUCTIONS),
        fc.boolean(),
        (q, f, c, solar) => {
          const r = rtsFractions((solar ? SOLAR_RTS_PERCENT : NONSOLAR_RTS_PERCENT)[c]);
          const cl = radiantTimeSeries(q, f, r);
          return Math.abs(sum(cl) - sum(q)) <= 1e-9 * (1 + sum(q.map(Math.abs)));
        },
      ),
    );
  });

  it('property: the same figures, to the last bit, as the series written with the wrap-round index (h − j) mod 24', () => {
    // The method's sum Q_c(h) = (1 − f)·q(h) + f·Σ_j r_j·q(h − j), j = 0…23 in order, hour −1 being hour 23
    // [PUB: ch. 18 radiant time series over the periodic day]: calc splits the loop at midnight instead of taking
    // the index mod 24 (speed); the terms and their order are the same, so the result must be identical.
    fc.assert(
      fc.property(day, fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(...RTS_CONSTRUCTIONS), (q, f, c) => {
        const r = rtsFractions(NONSOLAR_RTS_PERCENT[c]);
        const want = q.map((qh, h) => {
          let s = 0;
          for (let j = 0; j < 24; j += 1) s += (r[j] ?? 0) * (q[(h - j + 24) % 24] ?? 0);
          return (1 - f) * qh + f * s;
        });
        expect(Array.from(radiantTimeSeries(q, f, r))).toEqual(want);
      }),
    );
  });

  it('property: no hour’s cooling load is above the day’s highest gain nor below its lowest', () => {
    // [PUB: the method's definition — each hour's load is a weighted average of the gains, weights ≥ 0 adding to 1]
    fc.assert(
      fc.property(day, fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(...RTS_CONSTRUCTIONS), (q, f, c) => {
        const cl = radiantTimeSeries(q, f, rtsFractions(SOLAR_RTS_PERCENT[c]));
        const hi = Math.max(...q);
        const lo = Math.min(...q);
        return Array.from(cl).every(
          (x) => x <= hi + 1e-9 * Math.abs(hi) + 1e-9 && x >= lo - 1e-9 * Math.abs(lo) - 1e-9,
        );
      }),
    );
  });

  it('worked by hand: three hours of west sun, medium construction', () => {
    // Beam sun through unshaded glass, wholly radiant, solar factors of medium construction with carpet and 10 %
    // glass [PUB: Table 20]: r_0 … r_4 = 52, 16, 8, 5, 3 %, r_13 … r_15 = 1 %, r_19 … r_23 = 0.
    // Gain 1,000 Btu/h at hours 15, 16 and 17 (indices 14–16), none otherwise.
    const q = Array.from({ length: 24 }, (_, i) => (i >= 14 && i <= 16 ? 1000 : 0));
    const cl = radiantTimeSeries(q, 1, rtsFractions(SOLAR_RTS_PERCENT.medium));
    // hour 15: 0.52 × 1,000 = 520
    expect(cl[14]).toBeCloseTo(520, 9);
    // hour 17: 0.52 × 1,000 (hour 17) + 0.16 × 1,000 (hour 16) + 0.08 × 1,000 (hour 15) = 760
    expect(cl[16]).toBeCloseTo(760, 9);
    // hour 18: 0.16 + 0.08 + 0.05 of 1,000 = 290
    expect(cl[17]).toBeCloseTo(290, 9);
    // hour 6 of the next day (index 5, the day repeats): 13, 14 and 15 hours after → 1 % each = 30
    expect(cl[5]).toBeCloseTo(30, 9);
    // hour 11 (index 10): 18, 19 and 20 hours after → 1 + 0 + 0 % = 10
    expect(cl[10]).toBeCloseTo(10, 9);
    // the day's 3,000 Btu·h of gain all reach the load
    expect(sum(cl)).toBeCloseTo(3000, 9);
  });

  it('worked by hand: a wall’s gain is 54 % load at once and 46 % through the nonsolar factors', () => {
    // [PUB: Table 14 walls 0.46 radiant; Table 19 medium, carpet, 10 % glass: 46, 18, 10 %]
    // 100 Btu/h at hour 14 only: hour 14 → 54 + 0.46 × 46 = 75.16; hour 15 → 0.46 × 18 = 8.28; hour 16 → 4.6
    const q = Array.from({ length: 24 }, (_, i) => (i === 13 ? 100 : 0));
    const cl = radiantTimeSeries(q, 0.46, rtsFractions(NONSOLAR_RTS_PERCENT.medium));
    expect(cl[13]).toBeCloseTo(75.16, 9);
    expect(cl[14]).toBeCloseTo(8.28, 9);
    expect(cl[15]).toBeCloseTo(4.6, 9);
    expect(sum(cl)).toBeCloseTo(100, 9);
  });
});

describe('the design day carries the series', () => {
  const c = { ...conditions, latitudeDeg: 36 };

  it('each facing’s sun: the day’s cooling load equals the day’s gain through the glass, shaded or not', () => {
    // [PUB: the method's definition over the periodic day, as above]
    for (const construction of RTS_CONSTRUCTIONS) {
      const ctx = designDayContext({ ...c }, construction);
      for (const f of FACINGS) {
        const fs = ctx.facing[f];
        const gain = sum(fs.glassBeam) + sum(fs.glassDiffuse);
        expect(sum(fs.solarLoad)).toBeCloseTo(gain, 6);
        for (const shade of ['blinds', 'drapes', 'shades'] as const) {
          expect(sum(fs.shaded[shade].solarLoad)).toBeCloseTo(gain, 6);
          expect(sum(fs.shaded[shade].diffuseLoad)).toBeCloseTo(sum(fs.glassDiffuse), 6);
        }
        expect(sum(fs.diffuseLoad)).toBeCloseTo(sum(fs.glassDiffuse), 6);
      }
      // walls, attic ceilings and windows: the same day's total, moved in time
      expect(sum(ctx.wallLoadDt('W', 'dark', 'frame'))).toBeCloseTo(sum(ctx.wallDt('W', 'dark', 'frame')), 6);
      expect(sum(ctx.atticLoadDt('medium', false))).toBeCloseTo(sum(ctx.atticDt('medium', false)), 6);
      expect(sum(ctx.windowLoadDt(true))).toBeCloseTo(sum(ctx.outdoorDtF), 6);
    }
  });

  it('the stored sun lags the gain: a west window’s load peaks no earlier than its gain, and lower', () => {
    // [PUB: the method's definition — later factors carry part of each hour's gain into the evening]
    const ctx = designDayContext({ ...c });
    const fs = ctx.facing.W;
    const gain = Array.from(fs.glassBeam, (b, i) => b + (fs.glassDiffuse[i] ?? 0));
    const load = Array.from(fs.solarLoad);
    const peakGain = gain.indexOf(Math.max(...gain));
    const peakLoad = load.indexOf(Math.max(...load));
    expect(peakLoad).toBeGreaterThanOrEqual(peakGain);
    expect(Math.max(...load)).toBeLessThan(Math.max(...gain));
    // after sunset the room still gives back stored sun
    expect(load[21]).toBeGreaterThan(0);
    expect(gain[21]).toBe(0);
  });

  it('the review ranch: its block and peak hour, and its sun share, under the series (printed for the issue note)', () => {
    const h = homeLoad({ home: ranchHome });
    const share = h.sensibleGain.windowsSolar / h.sensibleGain.total;
    console.log(
      `review ranch (RTS, medium): block ${h.totals.coolingBtuh} Btu/h at ${h.block.hour}:00, ` +
        `${(h.totals.coolingBtuh / 1800).toFixed(2)} Btu/h·ft², sun ${(share * 100).toFixed(1)} % of sensible, SHR ${h.totals.sensibleHeatRatio}`,
    );
    // the whole-house check of the issue: block below the sum of the rooms' own peaks
    expect(h.totals.sensibleBtuh).toBeLessThan(h.block.sumOfRoomPeaksSensibleBtuh);
    expect(h.block.hour).toBeGreaterThanOrEqual(13);
    expect(h.block.hour).toBeLessThanOrEqual(17);
  });
});

describe('the house chooses its construction class', () => {
  it('unset is medium, said to be the default; a chosen class is used and named', () => {
    const plain = homeLoad({ home: ranchHome });
    expect(plain.designDay).toMatchObject({ thermalMass: 'medium', thermalMassAssumed: true });
    const heavy = homeLoad({ home: { ...ranchHome, thermalMass: 'heavy' } });
    expect(heavy.designDay).toMatchObject({ thermalMass: 'heavy', thermalMassAssumed: false });
    const light = homeLoad({ home: { ...ranchHome, thermalMass: 'light' } });
    // [PUB: Tables 19/20 — the heavier the room, the less of each hour's gain reaches the load at once, so the
    // ranch's afternoon peak falls light → medium → heavy]
    expect(light.totals.sensibleBtuh).toBeGreaterThan(plain.totals.sensibleBtuh);
    expect(plain.totals.sensibleBtuh).toBeGreaterThan(heavy.totals.sensibleBtuh);
    // heating has no sun and no storage: unchanged
    expect(heavy.totals.heatingBtuh).toBe(plain.totals.heatingBtuh);
  });

  it('an unknown class is refused with a plain message', () => {
    const r = houseSchema.safeParse({ thermalMass: 'granite' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toBe('Choose light, medium or heavy');
  });

  it('the live engine follows a change of class and stays equal to the full calculation', () => {
    const live = liveHome();
    for (const thermalMass of ['light', 'heavy', undefined, 'medium'] as const) {
      const home = homeInputSchema.parse({ ...ranchHome, ...(thermalMass ? { thermalMass } : {}) });
      expect(live.load(home)).toEqual(homeLoadFromParsed(home));
    }
  });
});
