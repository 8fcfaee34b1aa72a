import { DEFAULT_LATITUDE_DEG, GENERIC_CLEAR_SKY, type DesignConditions } from '../schemas/design-conditions';
import type { SurfaceColor } from '../schemas/room';
import {
  DAILY_RANGE_FRACTION,
  FACINGS,
  FACING_AZIMUTH_DEG,
  designDayOfYear,
  extraterrestrialIrradiance,
  airMassExponents,
  solarDeclinationDeg,
  solarPositionFast,
  type Facing,
  type SolarPosition,
} from '../solar/design-day';
import {
  ATTIC_RESPONSE,
  DEFAULT_RTS_CONSTRUCTION,
  MASS_RESPONSE,
  NONSOLAR_RTS_PERCENT,
  RADIANT_FRACTION,
  SHADED_SUN_RADIANT_FRACTION,
  SOLAR_RTS_PERCENT,
  SOL_AIR_ALPHA_OVER_HO,
  SOL_AIR_HORIZONTAL_LONGWAVE_F,
  SHGC_DIFFUSE_RATIO,
  shgcAngleRatio,
  type MassClass,
  type RtsConstruction,
  type ShadeKind,
} from './hourly-method';

const RAD = Math.PI / 180;
export const HOURS = 24;

/** One facing's clear-sky sun through the design day (index 0 = hour 1), Btu/h·ft². */
export interface FacingSun {
  /** Beam on the wall plane, E_b·cos θ. */
  readonly beam: Float64Array;
  /** Sky diffuse + ground reflected on the wall plane. */
  readonly diffuse: Float64Array;
  /** Beam through glass per unit label SHGC: E_b·cos θ × the angular SHGC ratio. */
  readonly glassBeam: Float64Array;
  /** Diffuse through glass per unit label SHGC: diffuse × the hemispherical ratio. */
  readonly glassDiffuse: Float64Array;
  /**
   * Cooling load each hour per unit A·SHGC of unshaded glass (RTS): the beam wholly radiant through the solar
   * factors plus the diffuse wholly radiant through the nonsolar factors.
   */
  readonly solarLoad: Float64Array;
  /** The diffuse part of `solarLoad` alone (what an overhang leaves untouched). */
  readonly diffuseLoad: Float64Array;
  /**
   * Cooling load per unit A·SHGC·IAC behind each interior shade: beam + diffuse, radiant part the shade's FR
   * (SHADED_SUN_RADIANT_FRACTION), nonsolar factors; `diffuseLoad` the diffuse part alone.
   */
  readonly shaded: Readonly<
    Record<ShadeKind, { readonly solarLoad: Float64Array; readonly diffuseLoad: Float64Array }>
  >;
  /** tan of the profile angle (for an overhang's shadow); 0 when the sun is not on the wall. */
  readonly profileTan: Float64Array;
}

/** Everything the hourly room loads need from the site, computed once per home. */
export interface DesignDayContext {
  readonly latitudeDeg: number;
  readonly latitudeAssumed: boolean;
  readonly month: number;
  readonly dayOfYear: number;
  readonly tauB: number;
  readonly tauD: number;
  readonly skySource: string;
  readonly skyIsGeneric: boolean;
  readonly indoorF: number;
  /** Outdoor dry bulb each hour, °F. */
  readonly outdoorF: Float64Array;
  /** Outdoor − indoor each hour, °F. */
  readonly outdoorDtF: Float64Array;
  readonly sun: readonly SolarPosition[];
  readonly facing: Readonly<Record<Facing, FacingSun>>;
  /** Total (beam + diffuse) on a horizontal roof each hour, Btu/h·ft². */
  readonly horizontal: Float64Array;
  /** The construction class whose radiant time factors turn heat gains into cooling loads. */
  readonly construction: RtsConstruction;
  /** Solar and nonsolar radiant time factors of that class (fractions, each series sums to 1). */
  readonly rts: { readonly solar: Float64Array; readonly nonsolar: Float64Array };
  /** Equivalent ΔT (°F) each hour for an opaque wall/door of this facing, colour and mass (cached): its heat gain. */
  wallDt(facing: Facing, color: SurfaceColor, mass: MassClass): Float64Array;
  /** The same wall's cooling-load ΔT: radiant part 0.46 through the nonsolar factors (cached). */
  wallLoadDt(facing: Facing, color: SurfaceColor, mass: MassClass): Float64Array;
  /** Window conduction cooling-load ΔT: outdoor − indoor, radiant part by the SHGC class, nonsolar factors (cached). */
  windowLoadDt(shgcOverHalf: boolean): Float64Array;
  /** Floor (over a garage) cooling-load ΔT per unit of outdoor − indoor: radiant part 0.46 (cached). */
  readonly floorLoadDt: Float64Array;
  /** Attic air − indoor each hour, °F (cached). */
  atticDt(color: SurfaceColor, radiantBarrier: boolean): Float64Array;
  /** Equivalent ΔT for an insulated roof deck (cathedral ceiling), frame mass (cached). */
  roofDt(color: SurfaceColor): Float64Array;
  /** Cooling-load ΔT of a ceiling under the attic: attic − indoor, radiant part 0.60 (the roof's), nonsolar factors. */
  atticLoadDt(color: SurfaceColor, radiantBarrier: boolean): Float64Array;
  /** Cooling-load ΔT of a roof deck: radiant part 0.60, nonsolar factors (cached). */
  roofLoadDt(color: SurfaceColor): Float64Array;
}

/** A column of radiant time factors in per cent as fractions. */
export function rtsFractions(percent: readonly number[]): Float64Array {
  const out = new Float64Array(HOURS);
  for (let j = 0; j < HOURS; j += 1) out[j] = (percent[j] ?? 0) / 100;
  return out;
}

/**
 * Cooling load from a heat gain over the periodic design day by the radiant time series: the convective
 * part (1 − f)·q(h) at once and the radiant part through the factors, Σ_j r_j · f·q(h − j), the day wrapping
 * round (hour −1 is hour 23). `out` may not be `q`.
 */
export function radiantTimeSeries(
  q: ArrayLike<number>,
  radiantFraction: number,
  factors: ArrayLike<number>,
  out: Float64Array = new Float64Array(HOURS),
): Float64Array {
  const conv = 1 - radiantFraction;
  for (let h = 0; h < HOURS; h += 1) {
    // Σ_j r_j·q(h − j), j = 0…23 in that order; the hours before midnight are h − j + 24 (no modulo in the loop).
    let s = 0;
    for (let j = 0; j <= h; j += 1) s += (factors[j] ?? 0) * (q[h - j] ?? 0);
    for (let j = h + 1; j < HOURS; j += 1) s += (factors[j] ?? 0) * (q[h - j + HOURS] ?? 0);
    out[h] = conv * (q[h] ?? 0) + radiantFraction * s;
  }
  return out;
}

/** Decrement-factor response: mean + λ·(Te(h − δ) − mean) − Ti. */
function laggedDt(te: Float64Array, indoorF: number, lag: number, decrement: number): Float64Array {
  let mean = 0;
  for (let h = 0; h < HOURS; h += 1) mean += te[h] ?? 0;
  mean /= HOURS;
  const out = new Float64Array(HOURS);
  for (let h = 0; h < HOURS; h += 1)
    out[h] = mean - indoorF + decrement * ((te[(h - lag + HOURS) % HOURS] ?? 0) - mean);
  return out;
}

/**
 * Builds the design day for a home's conditions: sun, clear sky, irradiance on every facing
 * and the roof, outdoor temperature, and cached sol-air responses. Equations: see
 * solar/design-day.ts (ASHRAE 2013 ch. 14) and hourly-method.ts.
 */
export function designDayContext(
  c: DesignConditions,
  construction: RtsConstruction = DEFAULT_RTS_CONSTRUCTION,
): DesignDayContext {
  const rts = {
    solar: rtsFractions(SOLAR_RTS_PERCENT[construction]),
    nonsolar: rtsFractions(NONSOLAR_RTS_PERCENT[construction]),
  };
  const nonsolarLoad = (q: ArrayLike<number>, f: number): Float64Array => radiantTimeSeries(q, f, rts.nonsolar);
  const latitudeAssumed = c.latitudeDeg === undefined;
  const latitudeDeg = c.latitudeDeg ?? DEFAULT_LATITUDE_DEG;
  // The summer design month by hemisphere when none is entered. [OWN: stated default]
  const month = c.designMonth ?? (latitudeDeg < 0 ? 1 : 7);
  const n = designDayOfYear(month);
  const skyIsGeneric = c.clearSkyTauB === undefined || c.clearSkyTauD === undefined;
  const tauB = skyIsGeneric ? GENERIC_CLEAR_SKY.tauB : (c.clearSkyTauB ?? GENERIC_CLEAR_SKY.tauB);
  const tauD = skyIsGeneric ? GENERIC_CLEAR_SKY.tauD : (c.clearSkyTauD ?? GENERIC_CLEAR_SKY.tauD);
  const skySource = skyIsGeneric ? GENERIC_CLEAR_SKY.source : (c.clearSkySource ?? 'Entered optical depths');

  const lat = latitudeDeg * RAD;
  const decl = solarDeclinationDeg(n) * RAD;
  const eo = extraterrestrialIrradiance(n);
  const { ab, ad } = airMassExponents(tauB, tauD);
  const indoorF = c.indoorCoolingF;

  const outdoorF = new Float64Array(HOURS);
  const outdoorDtF = new Float64Array(HOURS);
  const sun: SolarPosition[] = [];
  const beamNormal = new Float64Array(HOURS);
  const diffuseH = new Float64Array(HOURS);
  const horizontal = new Float64Array(HOURS);
  for (let h = 0; h < HOURS; h += 1) {
    const t = c.outdoorCoolingDryBulbF - (DAILY_RANGE_FRACTION[h] ?? 0) * c.dailyRangeF;
    outdoorF[h] = t;
    outdoorDtF[h] = t - indoorF;
    const s = solarPositionFast(lat, decl, 15 * (h + 1 - 12) * RAD);
    sun.push(s);
    if (s.altitudeDeg > 0) {
      const b = s.altitudeDeg;
      const m = 1 / (Math.sin(b * RAD) + 0.50572 * Math.pow(6.07995 + b, -1.6364));
      beamNormal[h] = eo * Math.exp(-tauB * Math.pow(m, ab));
      diffuseH[h] = eo * Math.exp(-tauD * Math.pow(m, ad));
      horizontal[h] = (beamNormal[h] ?? 0) * Math.sin(b * RAD) + (diffuseH[h] ?? 0);
    }
  }

  const facing = {} as Record<Facing, FacingSun>;
  for (const f of FACINGS) {
    const beam = new Float64Array(HOURS);
    const diffuse = new Float64Array(HOURS);
    const profileTan = new Float64Array(HOURS);
    const glassBeam = new Float64Array(HOURS);
    const glassDiffuse = new Float64Array(HOURS);
    for (let h = 0; h < HOURS; h += 1) {
      const s = sun[h];
      if (!s || s.altitudeDeg <= 0) continue;
      const cb = Math.cos(s.altitudeDeg * RAD);
      const sb = Math.sin(s.altitudeDeg * RAD);
      const cg = Math.cos((s.azimuthDeg - FACING_AZIMUTH_DEG[f]) * RAD);
      const cosTheta = cb * cg; // vertical wall [PUB: ASHRAE 2013 ch. 14 eq. 22]
      const y = Math.max(0.45, 0.55 + 0.437 * cosTheta + 0.313 * cosTheta * cosTheta); // eq. 25
      const eb = beamNormal[h] ?? 0;
      const ed = diffuseH[h] ?? 0;
      beam[h] = eb * Math.max(0, cosTheta);
      diffuse[h] = ed * y + (eb * sb + ed) * 0.2 * 0.5; // sky diffuse + ground reflected, ρg 0.2
      profileTan[h] = cg > 1e-9 ? Math.tan(s.altitudeDeg * RAD) / cg : 0;
      const thetaDeg = Math.acos(Math.max(-1, Math.min(1, cosTheta))) / RAD;
      glassBeam[h] = (beam[h] ?? 0) * shgcAngleRatio(thetaDeg);
      glassDiffuse[h] = (diffuse[h] ?? 0) * SHGC_DIFFUSE_RATIO;
    }
    const beamLoad = radiantTimeSeries(glassBeam, RADIANT_FRACTION.sunUnshaded, rts.solar);
    const diffuseLoad = nonsolarLoad(glassDiffuse, RADIANT_FRACTION.sunUnshaded);
    const solarLoad = new Float64Array(HOURS);
    for (let h = 0; h < HOURS; h += 1) solarLoad[h] = (beamLoad[h] ?? 0) + (diffuseLoad[h] ?? 0);
    // One pair of series per distinct radiant fraction (shades that share a fraction share the arrays).
    const byFraction = new Map<number, { solarLoad: Float64Array; diffuseLoad: Float64Array }>();
    const shadedFor = (fr: number) => {
      const hit = byFraction.get(fr);
      if (hit) return hit;
      const shadedBeam = nonsolarLoad(glassBeam, fr);
      const shadedDiffuseLoad = nonsolarLoad(glassDiffuse, fr);
      const shadedSolarLoad = new Float64Array(HOURS);
      for (let h = 0; h < HOURS; h += 1) shadedSolarLoad[h] = (shadedBeam[h] ?? 0) + (shadedDiffuseLoad[h] ?? 0);
      const made = { solarLoad: shadedSolarLoad, diffuseLoad: shadedDiffuseLoad };
      byFraction.set(fr, made);
      return made;
    };
    const shaded = {
      blinds: shadedFor(SHADED_SUN_RADIANT_FRACTION.blinds),
      drapes: shadedFor(SHADED_SUN_RADIANT_FRACTION.drapes),
      shades: shadedFor(SHADED_SUN_RADIANT_FRACTION.shades),
    };
    facing[f] = {
      beam,
      diffuse,
      glassBeam,
      glassDiffuse,
      solarLoad,
      diffuseLoad,
      shaded,
      profileTan,
    };
  }

  const cache = new Map<string, Float64Array>();
  const solAir = (irr: ArrayLike<number>, color: SurfaceColor, horizontalSurface: boolean): Float64Array => {
    const te = new Float64Array(HOURS);
    const k = SOL_AIR_ALPHA_OVER_HO[color];
    for (let h = 0; h < HOURS; h += 1)
      te[h] = (outdoorF[h] ?? 0) + k * (irr[h] ?? 0) - (horizontalSurface ? SOL_AIR_HORIZONTAL_LONGWAVE_F : 0);
    return te;
  };
  const facingTotal = (f: Facing): Float64Array => {
    const out = new Float64Array(HOURS);
    const fs = facing[f];
    for (let h = 0; h < HOURS; h += 1) out[h] = (fs.beam[h] ?? 0) + (fs.diffuse[h] ?? 0);
    return out;
  };

  const cached = (key: string, make: () => Float64Array): Float64Array => {
    let v = cache.get(key);
    if (!v) {
      v = make();
      cache.set(key, v);
    }
    return v;
  };

  const ctx: DesignDayContext = {
    construction,
    rts,
    floorLoadDt: nonsolarLoad(outdoorDtF, RADIANT_FRACTION.wallsAndFloors),
    latitudeDeg,
    latitudeAssumed,
    month,
    dayOfYear: n,
    tauB,
    tauD,
    skySource,
    skyIsGeneric,
    indoorF,
    outdoorF,
    outdoorDtF,
    sun,
    facing,
    horizontal,
    wallDt(f, color, mass) {
      return cached(`w${f}${color}${mass}`, () => {
        const r = MASS_RESPONSE[mass];
        return laggedDt(solAir(facingTotal(f), color, false), indoorF, r.lagHours, r.decrement);
      });
    },
    wallLoadDt(f, color, mass) {
      return cached(`W${f}${color}${mass}`, () =>
        nonsolarLoad(ctx.wallDt(f, color, mass), RADIANT_FRACTION.wallsAndFloors),
      );
    },
    windowLoadDt(over) {
      return cached(`g${over ? 1 : 0}`, () =>
        nonsolarLoad(outdoorDtF, over ? RADIANT_FRACTION.windowsShgcOverHalf : RADIANT_FRACTION.windowsShgcUnderHalf),
      );
    },
    atticDt(color, radiantBarrier) {
      return cached(`a${color}${radiantBarrier ? 1 : 0}`, () => {
        const te = solAir(horizontal, color, true);
        const k = radiantBarrier ? ATTIC_RESPONSE.radiantBarrier : ATTIC_RESPONSE.vented;
        const v = new Float64Array(HOURS);
        for (let h = 0; h < HOURS; h += 1) {
          const p = (h - ATTIC_RESPONSE.lagHours + HOURS) % HOURS;
          const to = outdoorF[p] ?? 0;
          v[h] = to + k * ((te[p] ?? 0) - to) - indoorF;
        }
        return v;
      });
    },
    roofDt(color) {
      return cached(`r${color}`, () => {
        const r = MASS_RESPONSE.frame;
        return laggedDt(solAir(horizontal, color, true), indoorF, r.lagHours, r.decrement);
      });
    },
    atticLoadDt(color, radiantBarrier) {
      return cached(`A${color}${radiantBarrier ? 1 : 0}`, () =>
        nonsolarLoad(ctx.atticDt(color, radiantBarrier), RADIANT_FRACTION.roof),
      );
    },
    roofLoadDt(color) {
      return cached(`R${color}`, () => nonsolarLoad(ctx.roofDt(color), RADIANT_FRACTION.roof));
    },
  };
  return ctx;
}
