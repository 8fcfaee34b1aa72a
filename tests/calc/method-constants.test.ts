import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  ATTIC_RESPONSE,
  basementFloorU,
  designConditionsSchema,
  designDayContext,
  GLASS_REFRACTIVE_INDEX,
  glassTransmittance,
  homeLoad,
  IDF_COEFFICIENTS,
  MASS_RESPONSE,
  METHOD_ASSUMPTIONS,
  METHOD_NOTES,
  methodAssumptionText,
  SHGC_DIFFUSE_RATIO,
  shgcAngleRatio,
  SOIL_CONDUCTIVITY,
  type HomeInput,
  type MethodAssumption,
} from '@calc';
import { ranchHome } from './ranch-home';

const RAD = Math.PI / 180;

/*
 * Glass at an angle: calc computes the angular SHGC ratio from Fresnel optics (hourly-method.ts).
 * Outside checks here: the refractive index against Rubin's published dispersion fit, and the
 * transmittance against the Fresnel equations written in their other (cosine) form, worked in the test.
 */
describe('angular SHGC from the optics of two clear panes', () => {
  it('the refractive index is soda-lime window glass at 0.55 µm by Rubin’s dispersion fit', () => {
    // [PUB: M. Rubin, "Optical properties of soda lime silica glasses", Solar Energy Materials 12 (1985)
    // 275–288 (LBL-13572), as given on refractiveindex.info: n = 1.5130 − 0.003169·λ² + 0.003962·λ⁻², λ in µm]
    const lambda = 0.55;
    const n = 1.513 - 0.003169 * lambda ** 2 + 0.003962 / lambda ** 2; // = 1.52508
    expect(GLASS_REFRACTIVE_INDEX).toBeCloseTo(n, 3);
  });

  it('normal incidence: each surface reflects ((n − 1)/(n + 1))², two panes pass (1 − r)/(1 + 3r) before absorption', () => {
    // [PUB: Fresnel equations at normal incidence; N covers τr = (1 − r)/(1 + (2N − 1)·r), Duffie and Beckman ch. 5]
    const n = 1.525;
    const r = ((n - 1) / (n + 1)) ** 2; // 0.04323
    expect(r).toBeCloseTo(0.0432, 4);
    expect(glassTransmittance(0, 2, n, 0)).toBeCloseTo((1 - r) / (1 + 3 * r), 6); // 0.8322
  });

  it('at 60°: the Fresnel equations in cosine form give the same two-pane transmittance', () => {
    // [PUB: Fresnel equations, r⊥ = ((cos θ − n·cos θr)/(cos θ + n·cos θr))², r∥ = ((n·cos θ − cos θr)/(n·cos θ + cos θr))²,
    // with Snell's law sin θ = n·sin θr; calc uses the sine/tangent form]
    const n = 1.525;
    const t = 60 * RAD;
    const tr = Math.asin(Math.sin(t) / n); // 34.60°
    const perp = ((Math.cos(t) - n * Math.cos(tr)) / (Math.cos(t) + n * Math.cos(tr))) ** 2; // 0.1853
    const par = ((n * Math.cos(t) - Math.cos(tr)) / (n * Math.cos(t) + Math.cos(tr))) ** 2; // 0.00134
    expect(tr / RAD).toBeCloseTo(34.6, 1);
    const tauR = 0.5 * ((1 - par) / (1 + 3 * par) + (1 - perp) / (1 + 3 * perp));
    const tauA = Math.exp((-2 * 0.03) / Math.cos(tr));
    expect(glassTransmittance(60, 2, n, 0.03)).toBeCloseTo(tauR * tauA, 6);
    expect(shgcAngleRatio(60)).toBeCloseTo((tauR * tauA) / glassTransmittance(0, 2, n, 0.03), 6);
  });

  it('property: the ratio is 1 at normal incidence, 0 at grazing, and never rises with the angle', () => {
    // Fresnel reflectance grows and the slanted path lengthens with θ, so transmittance can only fall
    expect(shgcAngleRatio(0)).toBe(1);
    expect(shgcAngleRatio(90)).toBe(0);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 90, noNaN: true }), fc.double({ min: 0, max: 90, noNaN: true }), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const rLo = shgcAngleRatio(lo);
        const rHi = shgcAngleRatio(hi);
        return rHi <= rLo + 1e-12 && rHi >= 0 && rLo <= 1;
      }),
    );
  });

  it('the hemispherical (diffuse) ratio is 2·∫ ratio·cos θ·sin θ dθ (Simpson’s rule here)', () => {
    const steps = 180;
    const h = Math.PI / 2 / steps;
    let s = 0;
    for (let i = 0; i <= steps; i += 1) {
      const t = i * h;
      const w = i === 0 || i === steps ? 1 : i % 2 ? 4 : 2;
      s += w * shgcAngleRatio(t / RAD) * Math.cos(t) * Math.sin(t);
    }
    expect(SHGC_DIFFUSE_RATIO).toBeCloseTo((2 * s * h) / 3, 3);
  });

  it('the assumed absorption K·L 0.03 per pane: 0 or 0.06 moves the ratio by under 0.015 at 60° and 2 % at any angle', () => {
    const ratio = (deg: number, kl: number) =>
      glassTransmittance(deg, 2, 1.525, kl) / glassTransmittance(0, 2, 1.525, kl);
    for (const kl of [0, 0.06]) {
      expect(Math.abs(ratio(60, kl) - shgcAngleRatio(60))).toBeLessThan(0.015);
      for (let deg = 1; deg < 90; deg += 1)
        expect(Math.abs(ratio(deg, kl) / shgcAngleRatio(deg) - 1)).toBeLessThan(0.02);
    }
  });
});

/*
 * The constants with no citable public source (issue 9: searched 5 Dec 2026 in handbooks' published
 * equations, public standards' excerpts, government/laboratory reports and university texts) are stated
 * as assumptions. Each says how far it moves the review ranch's cooling block between plausible values;
 * these tests recompute every figure the statement prints. Where the constant is a module-level table,
 * the test changes it in place for one calculation and restores it.
 */
const block = (home: HomeInput = ranchHome): number => homeLoad({ home }).totals.coolingBtuh;

function patched<T extends object>(target: T, patch: Partial<T>, run: () => number): number {
  const saved = { ...target };
  Object.assign(target, patch);
  try {
    return run();
  } finally {
    Object.assign(target, saved);
  }
}

/**
 * Eq. (10) of ASHRAE Fundamentals 2021 ch. 17 with a flue of share f of the leakage area: the wind part I0 grows by
 * 1 + I2·f (I2 0.12 cooling, 0.23 heating). Patched into the coefficients for one calculation.
 */
function withFlue(f: number, run: () => number): number {
  const c = IDF_COEFFICIENTS.cooling as { i0: number };
  const h = IDF_COEFFICIENTS.heating as { i0: number };
  const saved = [c.i0, h.i0];
  c.i0 *= 1 + IDF_COEFFICIENTS.cooling.i2 * f;
  h.i0 *= 1 + IDF_COEFFICIENTS.heating.i2 * f;
  try {
    return run();
  } finally {
    [c.i0, h.i0] = saved as [number, number];
  }
}

/** Each assumption's figures, recomputed: [as used, low, high]. */
const recompute: Record<string, () => [number, number, number] | null> = {
  'wall-mass': () => [
    block(),
    patched(MASS_RESPONSE.frame as { lagHours: number; decrement: number }, { lagHours: 0, decrement: 1 }, block),
    patched(MASS_RESPONSE.frame as { lagHours: number; decrement: number }, { lagHours: 2, decrement: 0.9 }, block),
  ],
  flue: () => [block(), block(), withFlue(0.5, block)],
  'glass-absorption': () => null,
  'basement-floor': () => null,
};

describe('assumptions with no published source: the method statement’s figures for the review ranch', () => {
  it('the review ranch as used: block 25,286 Btu/h at 15:00 (25,114 with the recalled 1997 daily-range table, 24,980 before the leakage of both seasons came from the driving force; 26,764 with the assumed solar storage ratio ½ the radiant time series replaced)', () => {
    const h = homeLoad({ home: ranchHome });
    expect(h.block.hour).toBe(15);
    expect(h.totals.coolingBtuh).toBe(25286);
  });

  it.each(METHOD_ASSUMPTIONS.map((a) => [a.key, a] as [string, MethodAssumption]))('%s', (key, a) => {
    const got = recompute[key]?.();
    if (a.ranch === null) {
      expect(got).toBeNull();
      expect(a.effect).toBeTruthy();
    } else {
      expect(got).not.toBeNull();
      const [used, low, high] = got!;
      // ±25 Btu/h: the statement gives whole Btu/h; this leaves room for rounding in other terms
      expect(Math.abs(used - a.ranch.asUsed)).toBeLessThanOrEqual(25);
      expect(Math.abs(low - a.ranch.low)).toBeLessThanOrEqual(25);
      expect(Math.abs(high - a.ranch.high)).toBeLessThanOrEqual(25);
    }
    expect(methodAssumptionText(a)).toMatch(
      a.notEntered ? /^Assumption \(not recorded on the walk-through\)/ : /^Assumption \(no published source found\)/,
    );
    // The statement's range reads smaller figure first, whichever end of the assumption gives it.
    const range = /between ([\d,]+) and ([\d,]+) Btu\/h/.exec(methodAssumptionText(a));
    if (a.ranch && a.ranch.low !== a.ranch.high) {
      const [lo, hi] = [range?.[1], range?.[2]].map((x) => Number((x ?? '').replace(/,/g, '')));
      expect(lo).toBe(Math.min(a.ranch.low, a.ranch.high));
      expect(hi).toBe(Math.max(a.ranch.low, a.ranch.high));
    }
  });

  it('glass absorption: the stated bound, 2 % of the ranch’s sun through glass, is about 225 Btu/h', () => {
    const h = homeLoad({ home: ranchHome });
    expect(h.sensibleGain.windowsSolar).toBe(11224);
    expect(Math.abs(0.02 * h.sensibleGain.windowsSolar - 225)).toBeLessThan(10);
  });

  it('they are listed from the largest swing of the ranch block down', () => {
    const swing = METHOD_ASSUMPTIONS.filter((a) => a.ranch && !a.ranch.variant).map((a) =>
      Math.max(Math.abs(a.ranch!.low - a.ranch!.asUsed), Math.abs(a.ranch!.high - a.ranch!.asUsed)),
    );
    expect([...swing].sort((x, y) => y - x)).toEqual(swing);
  });

  it('the method statement points to them where each constant is used', () => {
    const noteOf = (words: RegExp) => METHOD_NOTES.find((n) => words.test(n)) ?? '';
    for (const words of [/time lag and damping/, /below-grade method/])
      expect(noteOf(words)).toMatch(/assumption, see below|an assumption/);
    // Sourced since (issue 9): the daily range, the leakage of both seasons, the internal gains and the duct areas name their
    // publications where the method statement uses them.
    expect(noteOf(/daily range/)).toMatch(/PUB: ASHRAE Handbook—Fundamentals 2021 ch\. 14 Table 6/);
    expect(noteOf(/Air leakage/)).toMatch(/ch\. 17 eq\. \(10\)/);
    expect(noteOf(/464 \+ 0\.7/)).toMatch(/PUB: ASHRAE Handbook—Fundamentals 2021 ch\. 17 eqs\. \(30\)–\(31\)/);
    expect(noteOf(/27 %/)).toMatch(/Standard 152-2004/);
    expect(METHOD_NOTES.join(' ')).not.toMatch(/summer half|CFM50 ÷ 20/);
  });
});

/*
 * Time lag and damping from the exact periodic conduction solution. A layer of thickness L, conductivity k,
 * density ρ and specific heat c carries a daily temperature wave by the transfer matrix
 * [[cosh γL, sinh γL/(kγ)], [kγ·sinh γL, cosh γL]], γ = √(iω/α) = (1 + i)·√(ω/2α), α = k/(ρc) [PUB: the heat
 * equation's periodic solution, Carslaw and Jaeger, Conduction of Heat in Solids, ch. 3; the matrix form is the
 * one ISO 13786 uses]; films are [[1, R], [0, 1]]. With the inside held steady, the inside flux per degree of
 * outside swing is 1/Z12 of the product, so the decrement is U_dynamic/U = R_total/|Z12| and the lag is arg(Z12)/ω.
 * Material properties [PUB: Kosny et al., "Dynamic Thermal Performance and Energy Benefits of Using Massive
 * Walls in Residential Buildings", Oak Ridge National Laboratory, Table 3]. Films 0.044 outside and 0.12 inside
 * m²·K/W [MEM: ASHRAE ch. 26, ≈ ].
 */
type Cx = [number, number];
const cAdd = (a: Cx, b: Cx): Cx => [a[0] + b[0], a[1] + b[1]];
const cMul = (a: Cx, b: Cx): Cx => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const cDiv = (a: Cx, b: Cx): Cx => {
  const d = b[0] ** 2 + b[1] ** 2;
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
type Mx = [Cx, Cx, Cx, Cx];
const mMul = (a: Mx, b: Mx): Mx => [
  cAdd(cMul(a[0], b[0]), cMul(a[1], b[2])),
  cAdd(cMul(a[0], b[1]), cMul(a[1], b[3])),
  cAdd(cMul(a[2], b[0]), cMul(a[3], b[2])),
  cAdd(cMul(a[2], b[1]), cMul(a[3], b[3])),
];
const ORNL = {
  concrete: { k: 1.44, rho: 2240, c: 840 },
  foam: { k: 0.036, rho: 25.6, c: 1210 },
  gypsum: { k: 0.16, rho: 800, c: 1090 },
  stucco: { k: 0.72, rho: 1856, c: 840 },
} as const;
type Layer = { L: number; k: number; rho: number; c: number };
function layerMatrix({ L, k, rho, c }: Layer, periodS: number): Mx {
  const g = Math.sqrt(Math.PI / periodS / (k / (rho * c))); // √(ω/2α)
  const x = g * L;
  const coshGL: Cx = [Math.cosh(x) * Math.cos(x), Math.sinh(x) * Math.sin(x)];
  const sinhGL: Cx = [Math.sinh(x) * Math.cos(x), Math.cosh(x) * Math.sin(x)];
  const kGamma: Cx = [k * g, k * g];
  return [coshGL, cDiv(sinhGL, kGamma), cMul(kGamma, sinhGL), coshGL];
}
function periodicResponse(layers: Layer[], periodS = 86400): { decrement: number; lagHours: number; det: Cx } {
  const film = (r: number): Mx => [
    [1, 0],
    [r, 0],
    [0, 0],
    [1, 0],
  ];
  let m: Mx = film(0.044);
  for (const l of layers) m = mMul(m, layerMatrix(l, periodS));
  m = mMul(m, film(0.12));
  const rTotal = 0.044 + 0.12 + layers.reduce((s, l) => s + l.L / l.k, 0);
  const z12 = m[1];
  let phase = Math.atan2(z12[1], z12[0]);
  if (phase < 0) phase += 2 * Math.PI;
  return {
    decrement: rTotal / Math.hypot(z12[0], z12[1]),
    lagHours: phase / ((2 * Math.PI) / periodS) / 3600,
    det: cAdd(cMul(m[0], m[3]), cMul([-1, 0], cMul(m[1], m[2]))),
  };
}
const FRAME_WALL: Layer[] = [
  { L: 0.022, ...ORNL.stucco }, // ⅞ in stucco
  { L: 0.036 * 2.29, ...ORNL.foam }, // R-13 (2.29 m²·K/W) of insulation
  { L: 0.0127, ...ORNL.gypsum }, // ½ in gypsum board
];
const MASONRY_WALL: Layer[] = [
  { L: 0.2032, ...ORNL.concrete }, // 8 in concrete
  { L: 0.0127, ...ORNL.gypsum },
];

describe('wall time lag and damping from the periodic conduction solution', () => {
  it('the solution itself: each matrix has determinant 1, and a very slow wave passes undamped and unlagged', () => {
    const daily = periodicResponse(MASONRY_WALL);
    expect(daily.det[0]).toBeCloseTo(1, 9);
    expect(daily.det[1]).toBeCloseTo(0, 9);
    const slow = periodicResponse(MASONRY_WALL, 86400 * 1e6);
    expect(slow.decrement).toBeCloseTo(1, 4);
    expect(slow.lagHours / 1e6).toBeLessThan(1e-3);
  });

  it('a stuccoed R-13 frame wall: 0.98 and 1.3 h — calc’s frame 0.98 and 1 h', () => {
    const r = periodicResponse(FRAME_WALL);
    expect(r.decrement).toBeCloseTo(0.982, 3);
    expect(r.lagHours).toBeCloseTo(1.34, 2);
    expect(MASS_RESPONSE.frame.decrement).toBeCloseTo(r.decrement, 2);
    expect(MASS_RESPONSE.frame.lagHours).toBe(Math.round(r.lagHours));
  });

  it('8 in concrete with gypsum: 0.50 and 5.9 h — calc’s masonry 0.50 and 6 h', () => {
    const r = periodicResponse(MASONRY_WALL);
    expect(r.decrement).toBeCloseTo(0.495, 3);
    expect(r.lagHours).toBeCloseTo(5.91, 2);
    expect(MASS_RESPONSE.masonry.decrement).toBeCloseTo(r.decrement, 1);
    expect(Math.abs(MASS_RESPONSE.masonry.decrement - r.decrement)).toBeLessThan(0.01);
    expect(MASS_RESPONSE.masonry.lagHours).toBe(Math.round(r.lagHours));
  });
});

describe('radiant barrier against measured and simulated attics', () => {
  const c = designConditionsSchema.parse(ranchHome.designConditions);
  const ctx = designDayContext(c);
  const peakOf = (xs: Float64Array): number => xs.indexOf(Math.max(...xs));

  it('the attic air over outdoor with a barrier is the measured 36.1 / 42.9 of that without', () => {
    // [PUB: Parker and Sherwin, "Comparative Summer Attic Thermal Performance of Six Roof Constructions", FSEC 1998,
    // as tabulated at builditsolar.com/Projects/Cooling/FSECRoofPaperSummary.htm: black shingles, vented 1 in 300,
    // peak attic 134.9 °F without a radiant barrier and 128.1 °F with one, 92 °F outdoors]
    // 128.1 − 92 = 36.1 °F; 134.9 − 92 = 42.9 °F; 36.1 / 42.9 = 0.8415
    for (const color of ['light', 'medium', 'dark'] as const) {
      const vented = ctx.atticDt(color, false);
      const barrier = ctx.atticDt(color, true);
      const h = peakOf(vented);
      const over = (dt: number) => c.indoorCoolingF + dt - (ctx.outdoorF[(h - 1 + 24) % 24] ?? 0);
      expect(over(barrier[h] ?? 0) / over(vented[h] ?? 0)).toBeCloseTo(36.1 / 42.9, 3);
    }
    expect(ATTIC_RESPONSE.radiantBarrier).toBeCloseTo(0.45 * 0.8415, 3);
  });

  it('cuts a dark roof’s peak-hour ceiling gain by about the 12 % measured, and any roof’s by less than the 23 % Medina and Young simulated', () => {
    // [PUB: as above, "% reduction in attic to living space temperature difference": 12 % for the barrier alone;
    // the measured 12 % is at the site's 92 °F and about 77 °F indoors, here 95 °F and 75 °F, so ±4 points.]
    // [PUB: Medina and Young, "A perspective on the effect of climate and local environmental variables on the
    // performance of attic radiant barriers in the United States", Building and Environment 41 (2006) 1767–1778,
    // abstract: peak-hour reductions in ceiling heat flux, R-19 vented attic, 23 % (desert) to almost 100 %.]
    // Ceiling gain is U·A·(attic − indoor), so the cut is 1 − (attic − indoor with barrier)/(without) at the peak hour.
    for (const color of ['light', 'medium', 'dark'] as const) {
      const vented = ctx.atticDt(color, false);
      const barrier = ctx.atticDt(color, true);
      const h = peakOf(vented);
      const cut = 1 - (barrier[h] ?? 0) / (vented[h] ?? 1);
      console.log(`radiant barrier, ${color} roof: peak-hour ceiling gain cut ${(cut * 100).toFixed(1)} %`);
      expect(cut).toBeGreaterThan(0);
      expect(cut).toBeLessThan(0.23);
      if (color === 'dark') expect(Math.abs(cut - 0.12)).toBeLessThanOrEqual(0.04);
    }
  });
});

describe('basement floor: the closed form is the half-width average of its heat paths', () => {
  it('U_avg = 2k/(πw)·[ln(w/2 + z/2 + kR/π) − ln(z/2 + kR/π)] equals the mean of 1/(R + π(x + z/2)/k) over 0…w/2', () => {
    for (const [w, z, r] of [
      [24, 6, 1.2],
      [30, 8, 6],
      [16, 0.5, 0.5],
    ] as const) {
      const steps = 4000;
      let s = 0;
      for (let i = 0; i < steps; i += 1) {
        const x = ((i + 0.5) / steps) * (w / 2);
        s += 1 / (r + (Math.PI * (x + z / 2)) / SOIL_CONDUCTIVITY);
      }
      expect(basementFloorU({ widthFt: w, depthFt: z, rOther: r })).toBeCloseTo(s / steps, 5);
    }
  });
});

describe('vented attic air against measured attics', () => {
  it('dark shingles at 26.6° N in July: the peak attic air is about 40 °F over outdoor, as measured', () => {
    // [PUB: Parker, Sonne and Sherwin, "Comparative Evaluation of the Impact of Roofing Systems on Residential
    // Cooling Energy Demand in Florida", FSEC-CR-1220-00 (ACEEE Summer Study 2002): in the control home (standard
    // dark shingles, vented attic, Ft. Myers, 26.6° N) the attic air at the peak summer hour was 40 °F above ambient.]
    // The site's design day here (92 °F, 15 °F daily range, generic clear sky) is our own approximation [MEM],
    // so the check allows 15 %.
    const c = designConditionsSchema.parse({
      outdoorCoolingDryBulbF: 92,
      outdoorCoolingWetBulbF: 78,
      outdoorHeatingDryBulbF: 44,
      dailyRangeF: 15,
      latitudeDeg: 26.6,
      designMonth: 7,
    });
    const ctx = designDayContext(c);
    const overOutdoor = [...ctx.atticDt('dark', false)].map((dt, h) => c.indoorCoolingF + dt - (ctx.outdoorF[h] ?? 0));
    const peak = Math.max(...overOutdoor);
    expect(peak).toBeGreaterThan(40 * 0.85);
    expect(peak).toBeLessThan(40 * 1.15);
  });

  it('the attic air lags the roof by 1–2 h', () => {
    // [PUB: TenWolde, "FPL Roof Temperature and Moisture Model", USDA Forest Products Laboratory FPL-RP-561:
    // heat storage often delays attic air temperatures by 1 to 2 h]
    expect(ATTIC_RESPONSE.lagHours).toBeGreaterThanOrEqual(1);
    expect(ATTIC_RESPONSE.lagHours).toBeLessThanOrEqual(2);
  });
});
