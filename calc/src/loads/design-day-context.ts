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
  MASS_RESPONSE,
  SOLAR_RTS,
  SOL_AIR_ALPHA_OVER_HO,
  SOL_AIR_HORIZONTAL_LONGWAVE_F,
  SHGC_DIFFUSE_RATIO,
  shgcAngleRatio,
  type MassClass,
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
  /** glassBeam + glassDiffuse after the solar storage series (what reaches the load each hour per unit A·SHGC·IAC). */
  readonly stored: Float64Array;
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
  /** Equivalent ΔT (°F) each hour for an opaque wall/door of this facing, colour and mass (cached). */
  wallDt(facing: Facing, color: SurfaceColor, mass: MassClass): Float64Array;
  /** Attic air − indoor each hour, °F (cached). */
  atticDt(color: SurfaceColor, radiantBarrier: boolean): Float64Array;
  /** Equivalent ΔT for an insulated roof deck (cathedral ceiling), frame mass (cached). */
  roofDt(color: SurfaceColor): Float64Array;
}

/** Periodic convolution with the solar storage series: out[h] = Σ_j r_j · q[h − j]. */
export function storeSolar(q: ArrayLike<number>, out: Float64Array = new Float64Array(HOURS)): Float64Array {
  for (let h = 0; h < HOURS; h += 1) {
    let s = 0;
    for (let j = 0; j < HOURS; j += 1) s += (SOLAR_RTS[j] ?? 0) * (q[(h - j + HOURS) % HOURS] ?? 0);
    out[h] = s;
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
export function designDayContext(c: DesignConditions): DesignDayContext {
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
    const total = new Float64Array(HOURS);
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
      total[h] = (glassBeam[h] ?? 0) + (glassDiffuse[h] ?? 0);
    }
    facing[f] = { beam, diffuse, glassBeam, glassDiffuse, stored: storeSolar(total), profileTan };
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

  return {
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
      const key = `w${f}${color}${mass}`;
      let v = cache.get(key);
      if (!v) {
        const r = MASS_RESPONSE[mass];
        v = laggedDt(solAir(facingTotal(f), color, false), indoorF, r.lagHours, r.decrement);
        cache.set(key, v);
      }
      return v;
    },
    atticDt(color, radiantBarrier) {
      const key = `a${color}${radiantBarrier ? 1 : 0}`;
      let v = cache.get(key);
      if (!v) {
        const te = solAir(horizontal, color, true);
        const k = radiantBarrier ? ATTIC_RESPONSE.radiantBarrier : ATTIC_RESPONSE.vented;
        v = new Float64Array(HOURS);
        for (let h = 0; h < HOURS; h += 1) {
          const p = (h - ATTIC_RESPONSE.lagHours + HOURS) % HOURS;
          const to = outdoorF[p] ?? 0;
          v[h] = to + k * ((te[p] ?? 0) - to) - indoorF;
        }
        cache.set(key, v);
      }
      return v;
    },
    roofDt(color) {
      const key = `r${color}`;
      let v = cache.get(key);
      if (!v) {
        const r = MASS_RESPONSE.frame;
        v = laggedDt(solAir(horizontal, color, true), indoorF, r.lagHours, r.decrement);
        cache.set(key, v);
      }
      return v;
    },
  };
}
