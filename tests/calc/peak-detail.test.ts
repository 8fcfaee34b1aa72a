import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { apportion, apportionShare, homeLoad } from '@calc';
import { ranchHome } from './ranch-home';

describe('drill-down at each room’s peak hour: walls and windows by façade', () => {
  const load = homeLoad({ home: ranchHome });

  it('the façades add up to the room’s wall, door and window components', () => {
    for (const r of load.rooms) {
      const f = r.atPeak.facades;
      expect(r.atPeak.hour).toBe(r.peakHour);
      expect(f.reduce((s, x) => s + x.wallsBtuh, 0)).toBe(r.sensibleGain.walls);
      expect(f.reduce((s, x) => s + x.doorsBtuh, 0)).toBe(r.sensibleGain.doors);
      expect(f.reduce((s, x) => s + x.windowsConductionBtuh, 0)).toBe(r.sensibleGain.windowsConduction);
      expect(f.reduce((s, x) => s + x.windowsSolarBtuh, 0)).toBe(r.sensibleGain.windowsSolar);
    }
  });

  it('window conduction splits by U × A (same outdoor − indoor for every façade at one hour: Q = U·A·ΔT)', () => {
    // Living room: 60 ft² south and 20 ft² west double clear glass, same U → 3 : 1 (trade-facts §2, Q = U·A·ΔT).
    const living = load.rooms.find((r) => r.roomId === 'living');
    const s = living?.atPeak.facades.find((x) => x.direction === 'S');
    const w = living?.atPeak.facades.find((x) => x.direction === 'W');
    expect(s?.windowFt2).toBe(60);
    expect(w?.windowFt2).toBe(20);
    const total = (s?.windowsConductionBtuh ?? 0) + (w?.windowsConductionBtuh ?? 0);
    expect(Math.abs((s?.windowsConductionBtuh ?? 0) - 0.75 * total)).toBeLessThanOrEqual(1);
  });

  it('apportion: integers adding up to the total, each within 1 of its exact share (largest remainder)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 100000 }),
        fc.array(fc.double({ min: 0, max: 1e5, noNaN: true }), { minLength: 1, maxLength: 8 }),
        (total, raws) => {
          const out = apportion(total, raws);
          expect(out.reduce((a, b) => a + b, 0)).toBe(total);
          const sum = raws.reduce((a, b) => a + b, 0);
          if (sum > 0) out.forEach((x, i) => expect(Math.abs(x - (total * (raws[i] ?? 0)) / sum)).toBeLessThan(1));
        },
      ),
    );
  });

  /**
   * Largest remainder (Hamilton's method) written out plainly as the reference: each part gets the
   * floor of its exact share, then the parts with the largest remainders get one more each (the earlier
   * part first on equal remainders) until the total is reached; parts that are not positive finite
   * numbers count as 0, and with nothing to share by, the first part takes the total.
   */
  function largestRemainder(total: number, raws: readonly number[]): number[] {
    const clean = raws.map((r) => (r > 0 && Number.isFinite(r) ? r : 0));
    const sum = clean.reduce((a, b) => a + b, 0);
    if (raws.length === 0) return [];
    if (!(sum > 0)) return clean.map((_, i) => (i === 0 ? total : 0));
    const exact = clean.map((r) => (total * r) / sum);
    const out = exact.map(Math.floor);
    let left = total - out.reduce((a, b) => a + b, 0);
    const order = exact.map((e, i) => ({ i, rem: e - Math.floor(e) })).sort((a, b) => b.rem - a.rem || a.i - b.i);
    for (const { i } of order) {
      if (left <= 0) break;
      out[i] = (out[i] ?? 0) + 1;
      left -= 1;
    }
    return out;
  }

  it('apportion and apportionShare give each part what largest remainder gives it (ties, zeros, negatives, non-finite)', () => {
    // Small integer parts make equal remainders (ties go to the earlier part), zeros and negatives count as 0.
    const part = fc.oneof(
      fc.integer({ min: -3, max: 12 }),
      fc.double({ min: -10, max: 1e5, noNaN: true }),
      fc.constantFrom(0, Number.NaN, Number.POSITIVE_INFINITY),
    );
    fc.assert(
      fc.property(
        fc.oneof(fc.integer({ min: 0, max: 50 }), fc.integer({ min: 0, max: 100000 })),
        // Up to 12 parts, and up to 120 (a ducted house's rooms sharing each hour's duct gain: apportion picks
        // the remainders' cut-off by quickselect in scratch space that grows past 64 parts).
        fc.oneof(fc.array(part, { maxLength: 12 }), fc.array(part, { minLength: 30, maxLength: 120 })),
        (total, raws) => {
          const want = largestRemainder(total, raws);
          expect(apportion(total, raws)).toEqual(want);
          expect(apportion(total, Float64Array.from(raws))).toEqual(want);
          for (let j = -1; j <= raws.length; j += 1) expect(apportionShare(total, raws, j)).toBe(want[j] ?? 0);
        },
      ),
      { numRuns: 400 },
    );
  });
});
