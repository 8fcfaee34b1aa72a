import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { basementFloorU, belowGradeWallU, CalcError, roomLoad, SOIL_CONDUCTIVITY, type RoomInput } from '@calc';
import { conditions } from './sample-data';

/*
 * Basement walls and floors below grade (ASHRAE Handbook—Fundamentals ch. 18 below-grade method,
 * after Latta and Boileau): heat from depth z reaches the ground surface along a quarter circle of
 * length π·z/2 through soil of conductivity k = 0.8 Btu/h·ft·°F, so U(z) = 1/(R + π·z/(2k)). The
 * outside check integrates that definition numerically (Simpson's rule), independently of the
 * closed form calc uses.
 */
const K = 0.8;
function simpsonAverageU(z1: number, z2: number, r: number): number {
  const n = 2000;
  const h = (z2 - z1) / n;
  const u = (z: number) => 1 / (r + (Math.PI * z) / (2 * K));
  let s = u(z1) + u(z2);
  for (let i = 1; i < n; i += 1) s += (i % 2 ? 4 : 2) * u(z1 + i * h);
  return (s * h) / 3 / (z2 - z1);
}

describe('below-grade walls', () => {
  it('the average U over a depth equals the path-length model integrated numerically', () => {
    for (const [z1, z2, r] of [
      [0, 1, 1.59],
      [0, 7, 1.59],
      [2, 6, 11.6],
      [0, 4, 0.5],
    ] as const) {
      expect(belowGradeWallU({ z1Ft: z1, z2Ft: z2, rOther: r })).toBeCloseTo(simpsonAverageU(z1, z2, r), 6);
    }
  });

  it('reproduces the shape of the older handbook table for an uninsulated concrete wall, foot by foot', () => {
    // [MEM: ASHRAE Handbook—Fundamentals 1997 ch. 28, heat loss below grade in basement walls, uninsulated
    // 0.410 / 0.222 / 0.155 / 0.119 / 0.096 / 0.079 / 0.069 Btu/h·ft²·°F for each foot 0–1 … 6–7 ft].
    // One R_other (1.59, fitted to the first foot) gives every other foot within 0.003: the log law holds.
    const table = [0.41, 0.222, 0.155, 0.119, 0.096, 0.079, 0.069];
    table.forEach((u, i) => {
      expect(Math.abs(belowGradeWallU({ z1Ft: i, z2Ft: i + 1, rOther: 1.59 }) - u)).toBeLessThan(0.003);
    });
  });

  it('a basement room: walls lose above grade by U·A·ΔT and below grade by U_avg·A·(t_in − t_ground); nothing gained below grade in summer', () => {
    const basement = (belowGradeFt: number | undefined): RoomInput => ({
      id: 'rec',
      name: 'Basement family room',
      lengthFt: 24,
      widthFt: 16,
      ceilingHeightFt: 8,
      exposedWalls: [{ direction: 'N', lengthFt: 24, construction: 'masonry-uninsulated', belowGradeFt }],
      above: { kind: 'conditioned' },
      below: { kind: 'basement-floor', depthFt: 6, insulationR: 0 },
    });
    const c = { ...conditions, groundDesignF: 40 };
    const r = roomLoad({ room: basement(6), designConditions: c });
    // masonry-uninsulated U from the construction table; above grade 24 × 2 ft at 70 − 10 °F,
    // below grade 24 × 6 ft at 70 − 40 °F with the numerically integrated U_avg (R_other = 1/U).
    const u = 0.35; // the table's uninsulated masonry U is 0.35 [MEM: ASHRAE ch. 26 typical masonry]
    const expected = u * 48 * 60 + simpsonAverageU(0, 6, 1 / u) * 144 * 30;
    expect(Math.abs(r.heatLoss.walls - expected)).toBeLessThanOrEqual(0.5);
    // Cooling: the same room with only its 2 ft above grade as a wall gains exactly as much.
    const above = roomLoad({
      room: {
        ...basement(undefined),
        exposedWalls: [{ direction: 'N', lengthFt: 24, heightFt: 2, construction: 'masonry-uninsulated' }],
      },
      designConditions: c,
    });
    expect(r.hourlySensibleBtuh).toEqual(above.hourlySensibleBtuh);
    // No ground temperature entered: the outdoor heating design temperature stands in (more loss).
    const assumed = roomLoad({ room: basement(6), designConditions: conditions });
    expect(assumed.heatLoss.walls).toBeGreaterThan(r.heatLoss.walls);
    expect(assumed.heatLoss.floor).toBeGreaterThan(r.heatLoss.floor);
    expect(r.sensibleGain.floor).toBe(0);
  });

  it('refuses a depth below grade deeper than the wall', () => {
    try {
      roomLoad({
        room: {
          id: 'r',
          name: 'Basement',
          lengthFt: 10,
          widthFt: 10,
          ceilingHeightFt: 8,
          exposedWalls: [{ direction: 'N', lengthFt: 10, belowGradeFt: 9 }],
        },
        designConditions: conditions,
      });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(CalcError);
      expect((e as CalcError).details[0]).toEqual({
        path: ['exposedWalls', 0, 'belowGradeFt'],
        message: "The depth below grade (9 ft) is more than the wall's height (8 ft)",
      });
    }
  });
});

describe('basement floors [MEM: ASHRAE ch. 18 floor form, not re-checked]', () => {
  it('property: the average U falls as the basement gets wider, deeper or better insulated, and stays finite and positive', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 8, max: 80, noNaN: true }),
        fc.double({ min: 1, max: 12, noNaN: true }),
        fc.double({ min: 0, max: 20, noNaN: true }),
        (w, z, r) => {
          const u = basementFloorU({ widthFt: w, depthFt: z, rOther: 1.2 + r });
          expect(Number.isFinite(u) && u > 0).toBe(true);
          expect(basementFloorU({ widthFt: w + 4, depthFt: z, rOther: 1.2 + r })).toBeLessThan(u);
          expect(basementFloorU({ widthFt: w, depthFt: z + 1, rOther: 1.2 + r })).toBeLessThan(u);
          expect(basementFloorU({ widthFt: w, depthFt: z, rOther: 2.2 + r })).toBeLessThan(u);
        },
      ),
    );
  });
});

describe('soil conductivity', () => {
  it('lies inside the published range for soils, 0.3–1.4 Btu/h·ft·°F; the 0.8 itself stays from memory', () => {
    // [PUB: "Heat Loss from Basement Walls and Floors", engineer-educators.com/topic/7-heat-loss-from-basement-walls-and-floors:
    // soil conductivity 0.5–2.5 W/m·°C, or 0.3–1.4 Btu/h·ft·°F, by composition and moisture]
    // 1 W/m·K = 0.5778 Btu/h·ft·°F [PUB: NIST SP 811 conversion factors]
    expect(SOIL_CONDUCTIVITY).toBeGreaterThanOrEqual(0.5 * 0.5778);
    expect(SOIL_CONDUCTIVITY).toBeLessThanOrEqual(2.5 * 0.5778);
  });
});
