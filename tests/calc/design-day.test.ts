import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Body, Equator, Horizon, MakeTime, Observer, SearchHourAngle } from 'astronomy-engine';
import {
  DAILY_RANGE_FRACTION,
  airMass,
  clearSkyIrradiance,
  cosIncidence,
  designDayOfYear,
  extraterrestrialIrradiance,
  outdoorDryBulbAtHour,
  solarDeclinationDeg,
  solarPosition,
  surfaceIrradiance,
  verticalDiffuseRatio,
} from '@calc';

/**
 * Outside reference: astronomy-engine (npm, exact version in package.json), a general
 * astronomy library. Apparent solar time is taken from the library itself: the sun's
 * transit (hour angle 0) for an observer at the latitude, then ± hours, so the
 * comparison checks our declination/hour-angle/altitude/azimuth equations and nothing of ours
 * feeds the reference. Refraction off (the handbook's geometric altitude).
 */
function referenceSun(latitudeDeg: number, dayOfYear: number, solarTimeHours: number) {
  const observer = new Observer(latitudeDeg, 0, 0);
  const midnight = MakeTime(new Date(Date.UTC(2026, 0, dayOfYear)));
  const transit = SearchHourAngle(Body.Sun, observer, 0, midnight);
  const when = transit.time.AddDays((solarTimeHours - 12) / 24);
  const eq = Equator(Body.Sun, when, observer, true, true);
  const hor = Horizon(when, observer, eq.ra, eq.dec);
  return { altitudeDeg: hor.altitude, azimuthDeg: hor.azimuth };
}

function separationDeg(
  a: { altitudeDeg: number; azimuthDeg: number },
  b: { altitudeDeg: number; azimuthDeg: number },
): number {
  const r = Math.PI / 180;
  const c =
    Math.sin(a.altitudeDeg * r) * Math.sin(b.altitudeDeg * r) +
    Math.cos(a.altitudeDeg * r) * Math.cos(b.altitudeDeg * r) * Math.cos((a.azimuthDeg - b.azimuthDeg) * r);
  return Math.acos(Math.min(1, c)) / r;
}

const angleDiff = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180);

describe('solar position (ASHRAE 2013 ch. 14 eqs. 8, 11–16) against astronomy-engine', () => {
  const cases: [lat: number, n: number, hour: number][] = [];
  for (const lat of [-33, 0, 25, 40, 52, 64])
    for (const n of [21, 111, 172, 202, 233, 355])
      for (const hour of [7, 9.5, 12.5, 15, 17]) cases.push([lat, n, hour]);

  it.each(cases)(
    'latitude %d°, day %d, solar time %d h: altitude and azimuth within 0.5° (astronomy-engine)',
    (lat, n, hour) => {
      const ours = solarPosition({ latitudeDeg: lat, dayOfYear: n, solarTimeHours: hour });
      const ref = referenceSun(lat, n, hour);
      expect(Math.abs(ours.altitudeDeg - ref.altitudeDeg)).toBeLessThan(0.5);
      // The angle between the two sun directions on the sky (what reaches a wall depends on it).
      expect(separationDeg(ours, ref)).toBeLessThan(0.5);
      // Azimuth as an arc along the sun's altitude circle (azimuth difference × cos β): within 0.5°. The
      // handbook's declination (Cooper's form) is up to ≈ 0.4° off in April and October, which swings the
      // bare azimuth angle more the higher the sun is; by the arc it stays inside 0.5°.
      const arc = angleDiff(ours.azimuthDeg, ref.azimuthDeg) * Math.cos((ref.altitudeDeg * Math.PI) / 180);
      expect(arc).toBeLessThan(0.5);
      // In the cooling design months (May–September, north; November–March, south) the bare azimuth is within 0.5° too, with the sun below 60°.
      const coolingMonth = lat >= 0 ? n >= 121 && n <= 273 : n <= 90 || n >= 305;
      if (coolingMonth && ref.altitudeDeg < 60) expect(angleDiff(ours.azimuthDeg, ref.azimuthDeg)).toBeLessThan(0.5);
    },
  );

  it('trade-facts §3a.1: L 40°, 21 July (n 202), solar noon → β 70.44°, azimuth 180° (computed from the handbook equations)', () => {
    const s = solarPosition({ latitudeDeg: 40, dayOfYear: 202, solarTimeHours: 12 });
    expect(s.altitudeDeg).toBeCloseTo(70.44, 1);
    expect(s.azimuthDeg).toBeCloseTo(180, 6);
  });

  it('trade-facts §3a.2: L 36°, n 202, 16:00 → β 35.76°, azimuth 270.5°; west wall cos θ 0.8115, Y 1.1107', () => {
    const s = solarPosition({ latitudeDeg: 36, dayOfYear: 202, solarTimeHours: 16 });
    expect(s.altitudeDeg).toBeCloseTo(35.76, 1);
    expect(s.azimuthDeg).toBeCloseTo(270.5, 0);
    const c = cosIncidence({
      altitudeDeg: s.altitudeDeg,
      azimuthDeg: s.azimuthDeg,
      surfaceAzimuthDeg: 270,
      tiltDeg: 90,
    });
    expect(c).toBeCloseTo(0.8115, 3);
    expect(verticalDiffuseRatio(c)).toBeCloseTo(1.1107, 3);
  });

  it('declination: Cooper form 23.45° at n 172 (sin 360·456/365 = sin 449.75° ≈ 1) — ASHRAE 2013 ch. 14 eq. 8', () => {
    // 360 × (172 + 284)/365 = 449.753°; sin(89.753°) = 0.999991 → 23.4498°
    expect(solarDeclinationDeg(172)).toBeCloseTo(23.4498, 3);
  });

  it('design days are the 21st: July → n 202, December → n 355 (ASHRAE ch. 14 monthly design days)', () => {
    expect(designDayOfYear(7)).toBe(31 + 28 + 31 + 30 + 31 + 30 + 21);
    expect(designDayOfYear(12)).toBe(334 + 21);
    expect(() => designDayOfYear(13)).toThrow();
  });

  it('property: the sun is symmetric about solar noon (altitude equal, azimuths mirror about 180°) — geometry of eqs. 11–16', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -60, max: 70, noNaN: true }),
        fc.integer({ min: 1, max: 365 }),
        fc.double({ min: 0, max: 11, noNaN: true }),
        (lat, n, dh) => {
          const am = solarPosition({ latitudeDeg: lat, dayOfYear: n, solarTimeHours: 12 - dh });
          const pm = solarPosition({ latitudeDeg: lat, dayOfYear: n, solarTimeHours: 12 + dh });
          expect(am.altitudeDeg).toBeCloseTo(pm.altitudeDeg, 9);
          if (Math.abs(am.altitudeDeg) < 89.9 && dh > 1e-6)
            expect(angleDiff(am.azimuthDeg + pm.azimuthDeg, 360)).toBeLessThan(1e-6);
        },
      ),
    );
  });
});

describe('clear-sky irradiance (ASHRAE 2013 ch. 14 eqs. 4, 16–20)', () => {
  it('trade-facts §3a.3: β 45°, n 172, τb 0.40, τd 2.30 → m 1.4126, E_b 252.4, E_d 34.78 Btu/h·ft²', () => {
    // Independent arithmetic in the test, from the handbook equations:
    //   E_o = 433.6 × (1 + 0.033 × cos(360 × 169/365)) = 433.6 × (1 + 0.033 × cos 166.68°) = 433.6 × 0.967885
    const eo = 433.6 * (1 + 0.033 * Math.cos(((360 * 169) / 365) * (Math.PI / 180)));
    expect(extraterrestrialIrradiance(172)).toBeCloseTo(eo, 9);
    //   m = 1/(sin 45° + 0.50572 × 51.07995^−1.6364)
    const m = 1 / (Math.SQRT1_2 + 0.50572 * Math.pow(51.07995, -1.6364));
    expect(airMass(45)).toBeCloseTo(1.4126, 4);
    expect(airMass(45)).toBeCloseTo(m, 12);
    //   ab = 1.454 − 0.406 × 0.40 − 0.268 × 2.30 + 0.021 × 0.40 × 2.30 = 0.69452
    //   ad = 0.507 + 0.205 × 0.40 − 0.080 × 2.30 − 0.190 × 0.40 × 2.30 = 0.2302
    const eb = eo * Math.exp(-0.4 * Math.pow(m, 0.69452));
    const ed = eo * Math.exp(-2.3 * Math.pow(m, 0.2302));
    const sky = clearSkyIrradiance({ altitudeDeg: 45, dayOfYear: 172, tauB: 0.4, tauD: 2.3 });
    expect(sky.beamNormal).toBeCloseTo(eb, 9);
    expect(sky.diffuseHorizontal).toBeCloseTo(ed, 9);
    expect(sky.beamNormal).toBeCloseTo(252.4, 1);
    expect(sky.diffuseHorizontal).toBeCloseTo(34.78, 2);
  });

  it('trade-facts §3a.4: β 70°, n 202, τb 0.35, τd 2.50 → m 1.0637, E_b 291.6, E_d 33.35', () => {
    expect(airMass(70)).toBeCloseTo(1.0637, 4);
    const sky = clearSkyIrradiance({ altitudeDeg: 70, dayOfYear: 202, tauB: 0.35, tauD: 2.5 });
    expect(sky.beamNormal).toBeCloseTo(291.6, 1);
    expect(sky.diffuseHorizontal).toBeCloseTo(33.35, 2);
  });

  it('no sun below the horizon (definition)', () => {
    expect(clearSkyIrradiance({ altitudeDeg: -3, dayOfYear: 202, tauB: 0.4, tauD: 2.3 })).toEqual({
      beamNormal: 0,
      diffuseHorizontal: 0,
    });
  });

  it('a west wall at 16:00, L 36°, 21 July: beam E_b·cos θ, diffuse E_d·Y, reflected (E_b sin β + E_d)·0.2·½ (eqs. 23–26)', () => {
    const sun = solarPosition({ latitudeDeg: 36, dayOfYear: 202, solarTimeHours: 16 });
    const sky = clearSkyIrradiance({ altitudeDeg: sun.altitudeDeg, dayOfYear: 202, tauB: 0.4, tauD: 2.3 });
    const w = surfaceIrradiance(sun, sky, { kind: 'vertical', azimuthDeg: 270 });
    // Using §3a.2's cos θ 0.8115 and Y 1.1107, sin β = sin 35.76° = 0.5844
    expect(w.beam).toBeCloseTo(sky.beamNormal * 0.8115, 0);
    expect(w.diffuse).toBeCloseTo(sky.diffuseHorizontal * 1.1107, 1);
    expect(w.reflected).toBeCloseTo((sky.beamNormal * 0.5844 + sky.diffuseHorizontal) * 0.1, 0);
    // the east wall faces away: beam 0, Y at its floor 0.45
    const e = surfaceIrradiance(sun, sky, { kind: 'vertical', azimuthDeg: 90 });
    expect(e.beam).toBe(0);
    expect(e.diffuse).toBeCloseTo(sky.diffuseHorizontal * 0.45, 9);
  });
});

describe('outdoor dry bulb through the design day (fraction of daily range, ASHRAE Handbook—Fundamentals 2021 ch. 14 Table 6)', () => {
  /*
   * The handbook's worked Example 9 (2021 SI ch. 14, "Deriving Hourly Design-Day Temperatures") and its Table 8:
   * Atlanta, July 5 % design day, DB 33.1 °C, daily range 11.2 K, daylight time, so local hour h is solar hour
   * h − 2 rounded ("AST for hour 1 LDT is −0.73. The nearest hour to the AST is 23"). The function is linear in
   * its inputs, so the °C figures go in as they are. Table 8's dry bulbs, hours 1–24 LDT:
   */
  const TABLE_8_DB_C = [
    24.7, 23.9, 23.2, 22.8, 22.5, 22.1, 21.9, 22.1, 22.9, 24.8, 26.9, 28.8, 30.5, 31.6, 32.5, 33.1, 33.1, 32.4, 31.5,
    30.4, 28.7, 27.5, 26.5, 25.5,
  ];
  it('reproduces the handbook’s worked Atlanta design day (Example 9, Table 8) at all 24 hours to its 0.1 °C', () => {
    TABLE_8_DB_C.forEach((expected, i) => {
      const ldt = i + 1;
      const solar = ((ldt - 2 - 1 + 24) % 24) + 1;
      const got = outdoorDryBulbAtHour({ designDryBulbF: 33.1, dailyRangeF: 11.2, hour: solar });
      expect(Math.abs(got - expected)).toBeLessThanOrEqual(0.05 + 1e-9);
    });
  });
  it('95 °F design, 20 °F range: 95 at 14:00 and 15:00, 75 at 05:00 (the table’s top and bottom as published)', () => {
    expect(outdoorDryBulbAtHour({ designDryBulbF: 95, dailyRangeF: 20, hour: 14 })).toBe(95);
    expect(outdoorDryBulbAtHour({ designDryBulbF: 95, dailyRangeF: 20, hour: 15 })).toBe(95);
    expect(outdoorDryBulbAtHour({ designDryBulbF: 95, dailyRangeF: 20, hour: 5 })).toBe(75);
    expect(DAILY_RANGE_FRACTION).toHaveLength(24);
  });
  it('refuses an hour outside 1–24', () => {
    expect(() => outdoorDryBulbAtHour({ designDryBulbF: 95, dailyRangeF: 20, hour: 25 })).toThrow();
    expect(() => outdoorDryBulbAtHour({ designDryBulbF: 95, dailyRangeF: 20, hour: 0 })).toThrow();
  });
});

describe('southern hemisphere design day', () => {
  it('with no design month entered, a southern site takes January and a northern one July', async () => {
    const { homeLoad } = await import('@calc');
    const { ranchHome } = await import('./ranch-home');
    const { designMonth: _m, ...rest } = ranchHome.designConditions;
    const south = homeLoad({ home: { ...ranchHome, designConditions: { ...rest, latitudeDeg: -33.9 } } });
    const north = homeLoad({ home: { ...ranchHome, designConditions: { ...rest, latitudeDeg: 33.9 } } });
    expect(south.designDay.month).toBe(1);
    // 21 January is day 21 of the year (ASHRAE ch. 14 monthly design day: the 21st)
    expect(south.designDay.dayOfYear).toBe(21);
    expect(north.designDay.month).toBe(7);
    // Noon sun at 33.9° S on 21 January stands in the north: δ = 23.45·sin(360°·(21 + 284)/365) = −20.14°
    // (ASHRAE ch. 14 declination), altitude 90 − |L − δ| = 90 − 13.76 = 76.24°, azimuth 0° (north).
    const { solarPosition } = await import('@calc');
    const noon = solarPosition({ latitudeDeg: -33.9, dayOfYear: 21, solarTimeHours: 12 });
    expect(noon.altitudeDeg).toBeCloseTo(76.24, 1);
    expect(Math.min(noon.azimuthDeg, 360 - noon.azimuthDeg)).toBeLessThan(0.01);
  });
});
