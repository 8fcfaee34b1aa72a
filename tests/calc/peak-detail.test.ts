import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { apportion, homeLoad } from '@calc';
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
});
