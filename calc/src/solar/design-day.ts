import { num } from '../errors';

/**
 * The design day hour by hour: where the sun is, how much clear-sky sun reaches each
 * façade and the roof, and the outdoor dry bulb each hour. Pure functions, no rounding.
 *
 * Equations: ASHRAE Handbook—Fundamentals 2013, ch. 14 "Climatic Design Information"
 * (solar geometry, eqs. 7–16; the 2013 clear-sky model, eqs. 17–20; irradiance on a
 * surface, eqs. 21–27) [PUB as restated in the project's trade-facts §3a; MEM for the
 * equation numbers]. Angles in degrees at the edges, radians inside.
 */

const RAD = Math.PI / 180;

/** Day of year (1–365) of the 21st of each month: ASHRAE's design days are the 21st. [PUB: ch. 14 Table 2 days] */
export const DESIGN_DAY_OF_MONTH = [21, 52, 80, 111, 141, 172, 202, 233, 264, 294, 325, 355] as const;

/** Day of year of the design day of `month` (1–12), non-leap year. */
export function designDayOfYear(month: number): number {
  const m = num(month, 'positive');
  const n = DESIGN_DAY_OF_MONTH[m - 1];
  if (n === undefined || !Number.isInteger(m)) return num(Number.NaN);
  return n;
}

/** Solar declination, degrees: δ = 23.45° · sin[360° · (n + 284)/365]. [PUB: ASHRAE 2013 ch. 14 eq. 8] */
export function solarDeclinationDeg(dayOfYear: number): number {
  return 23.45 * Math.sin(((360 * (num(dayOfYear, 'positive') + 284)) / 365) * RAD);
}

export interface SolarPosition {
  /** Solar altitude β above the horizon, degrees (negative at night). */
  readonly altitudeDeg: number;
  /** Solar azimuth, degrees clockwise from north: 90 east, 180 south, 270 west. */
  readonly azimuthDeg: number;
}

/**
 * Sun position at a solar time of day. [PUB: ASHRAE 2013 ch. 14 eqs. 11–16]
 * - hour angle H = 15° · (AST − 12);
 * - sin β = cos L · cos δ · cos H + sin L · sin δ;
 * - azimuth from south φ: sin φ = sin H · cos δ / cos β, cos φ = (cos H · cos δ · sin L − sin δ · cos L)/cos β
 *   (positive afternoon, west); returned clockwise from north as 180° + φ.
 */
export function solarPosition({
  latitudeDeg,
  dayOfYear,
  solarTimeHours,
}: {
  readonly latitudeDeg: number;
  readonly dayOfYear: number;
  readonly solarTimeHours: number;
}): SolarPosition {
  const lat = num(latitudeDeg);
  const t = num(solarTimeHours, 'nonNegative');
  return solarPositionFast(lat * RAD, solarDeclinationDeg(dayOfYear) * RAD, 15 * (t - 12) * RAD);
}

/** `solarPosition` on radians already checked (the hourly engine calls it 24 times a home). */
export function solarPositionFast(lat: number, decl: number, hourAngle: number): SolarPosition {
  const sinBeta = Math.cos(lat) * Math.cos(decl) * Math.cos(hourAngle) + Math.sin(lat) * Math.sin(decl);
  const beta = Math.asin(Math.max(-1, Math.min(1, sinBeta)));
  const sinPhi = Math.sin(hourAngle) * Math.cos(decl);
  const cosPhi = Math.cos(hourAngle) * Math.cos(decl) * Math.sin(lat) - Math.sin(decl) * Math.cos(lat);
  // atan2 of the two numerators: cos β > 0 divides both, so it drops out.
  const phi = Math.atan2(sinPhi, cosPhi) / RAD;
  let az = 180 + phi;
  if (az >= 360) az -= 360;
  if (az < 0) az += 360;
  return { altitudeDeg: beta / RAD, azimuthDeg: az };
}

/** Extraterrestrial normal irradiance, Btu/h·ft²: E_o = 433.6 · [1 + 0.033 · cos(360° · (n − 3)/365)]. [PUB: ASHRAE 2013 ch. 14 eq. 4] */
export function extraterrestrialIrradiance(dayOfYear: number): number {
  return 433.6 * (1 + 0.033 * Math.cos(((360 * (num(dayOfYear, 'positive') - 3)) / 365) * RAD));
}

/** Relative air mass: m = 1/[sin β + 0.50572 · (6.07995 + β)^−1.6364], β in degrees. [PUB: ASHRAE 2013 ch. 14 eq. 16 (Kasten and Young)] */
export function airMass(altitudeDeg: number): number {
  const b = num(altitudeDeg);
  return 1 / (Math.sin(b * RAD) + 0.50572 * Math.pow(6.07995 + b, -1.6364));
}

/** Air-mass exponents of the 2013 clear-sky model. [PUB: ASHRAE 2013 ch. 14 eqs. 19–20] */
export function airMassExponents(tauB: number, tauD: number): { ab: number; ad: number } {
  return {
    ab: 1.454 - 0.406 * tauB - 0.268 * tauD + 0.021 * tauB * tauD,
    ad: 0.507 + 0.205 * tauB - 0.08 * tauD - 0.19 * tauB * tauD,
  };
}

export interface ClearSky {
  /** Beam normal irradiance E_b, Btu/h·ft². */
  readonly beamNormal: number;
  /** Diffuse horizontal irradiance E_d, Btu/h·ft². */
  readonly diffuseHorizontal: number;
}

/**
 * Clear-sky irradiance (ASHRAE 2013 model): E_b = E_o · exp(−τb · m^ab), E_d = E_o · exp(−τd · m^ad).
 * Zero when the sun is at or below the horizon. [PUB: ASHRAE 2013 ch. 14 eqs. 17–18]
 */
export function clearSkyIrradiance({
  altitudeDeg,
  dayOfYear,
  tauB,
  tauD,
}: {
  readonly altitudeDeg: number;
  readonly dayOfYear: number;
  readonly tauB: number;
  readonly tauD: number;
}): ClearSky {
  const b = num(altitudeDeg);
  const tb = num(tauB, 'positive');
  const td = num(tauD, 'positive');
  if (b <= 0) return { beamNormal: 0, diffuseHorizontal: 0 };
  const eo = extraterrestrialIrradiance(dayOfYear);
  const m = airMass(b);
  const { ab, ad } = airMassExponents(tb, td);
  return { beamNormal: eo * Math.exp(-tb * Math.pow(m, ab)), diffuseHorizontal: eo * Math.exp(-td * Math.pow(m, ad)) };
}

/** Ground reflectance used for the ground-reflected part. [TRADE: ρg ≈ 0.2, common practice] */
export const GROUND_REFLECTANCE = 0.2;

/**
 * Cosine of the angle of incidence on a surface of tilt Σ (0 horizontal, 90 vertical) facing
 * `surfaceAzimuthDeg` (clockwise from north): cos θ = cos β · cos γ · sin Σ + sin β · cos Σ,
 * γ = sun azimuth − surface azimuth. [PUB: ASHRAE 2013 ch. 14 eqs. 21–22] May be negative (sun behind).
 */
export function cosIncidence({
  altitudeDeg,
  azimuthDeg,
  surfaceAzimuthDeg,
  tiltDeg,
}: {
  readonly altitudeDeg: number;
  readonly azimuthDeg: number;
  readonly surfaceAzimuthDeg: number;
  readonly tiltDeg: number;
}): number {
  const b = num(altitudeDeg) * RAD;
  const g = (num(azimuthDeg) - num(surfaceAzimuthDeg)) * RAD;
  const s = num(tiltDeg) * RAD;
  return Math.cos(b) * Math.cos(g) * Math.sin(s) + Math.sin(b) * Math.cos(s);
}

/** The three parts of clear-sky irradiance on a surface, Btu/h·ft², each ≥ 0. */
export interface SurfaceIrradiance {
  readonly beam: number;
  readonly diffuse: number;
  readonly reflected: number;
  /** cos θ (≥ 0; 0 when the sun is behind the surface or below the horizon). */
  readonly cosTheta: number;
}

/** Sky-diffuse ratio for a vertical surface: Y = max(0.45, 0.55 + 0.437 cos θ + 0.313 cos² θ). [PUB: ASHRAE 2013 ch. 14 eq. 25] */
export function verticalDiffuseRatio(cosTheta: number): number {
  const c = num(cosTheta);
  return Math.max(0.45, 0.55 + 0.437 * c + 0.313 * c * c);
}

/**
 * Clear-sky irradiance on a vertical wall or a horizontal roof. [PUB: ASHRAE 2013 ch. 14 eqs. 23–27]
 * - beam E_b · max(cos θ, 0);
 * - sky diffuse: vertical E_d · Y, horizontal E_d;
 * - ground reflected: (E_b · sin β + E_d) · ρg · (1 − cos Σ)/2 (zero for a horizontal roof).
 */
export function surfaceIrradiance(
  sun: SolarPosition,
  sky: ClearSky,
  surface: { readonly kind: 'vertical'; readonly azimuthDeg: number } | { readonly kind: 'horizontal' },
): SurfaceIrradiance {
  if (sun.altitudeDeg <= 0) return { beam: 0, diffuse: 0, reflected: 0, cosTheta: 0 };
  const sinB = Math.sin(sun.altitudeDeg * RAD);
  if (surface.kind === 'horizontal') {
    return { beam: sky.beamNormal * sinB, diffuse: sky.diffuseHorizontal, reflected: 0, cosTheta: sinB };
  }
  const c = Math.cos(sun.altitudeDeg * RAD) * Math.cos((sun.azimuthDeg - surface.azimuthDeg) * RAD);
  const cosTheta = Math.max(0, c);
  return {
    beam: sky.beamNormal * cosTheta,
    diffuse: sky.diffuseHorizontal * verticalDiffuseRatio(c),
    reflected: (sky.beamNormal * sinB + sky.diffuseHorizontal) * GROUND_REFLECTANCE * 0.5,
    cosTheta,
  };
}

/**
 * Fraction of the daily range below the design dry bulb at each hour 1–24 (local solar time): 1 at 05:00 (the
 * minimum), 0 at 14:00 and 15:00 (the top). [PUB: ASHRAE Handbook—Fundamentals 2021 (SI) ch. 14 Table 6
 * "Fraction of Daily Temperature Range", p. 14.13 — the table the 2009 and later editions give for design-day
 * temperatures; read in two public copies (an open-source climatic-design library that cites the page, and a copy
 * of the 2021 chapter), and checked against the chapter's worked Example 9 (Table 8) in
 * tests/calc/design-day.test.ts. It replaced the 1997 ch. 28 Table 2 digits, which were recalled.]
 */
export const DAILY_RANGE_FRACTION = [
  0.88, 0.92, 0.95, 0.98, 1.0, 0.98, 0.91, 0.74, 0.55, 0.38, 0.23, 0.13, 0.05, 0.0, 0.0, 0.06, 0.14, 0.24, 0.39, 0.5,
  0.59, 0.68, 0.75, 0.82,
] as const;
export const DAILY_RANGE_SOURCE =
  '[PUB: ASHRAE Handbook—Fundamentals 2021 ch. 14 Table 6, fraction of daily temperature range: 1 at 05:00, 0 at 14:00 and 15:00]';

/** Outdoor dry bulb at `hour` (1–24, local solar time), °F = design dry bulb − fraction(hour) × daily range. */
export function outdoorDryBulbAtHour({
  designDryBulbF,
  dailyRangeF,
  hour,
}: {
  readonly designDryBulbF: number;
  readonly dailyRangeF: number;
  readonly hour: number;
}): number {
  const h = num(hour, 'positive');
  const f = DAILY_RANGE_FRACTION[h - 1];
  if (f === undefined || !Number.isInteger(h)) return num(Number.NaN);
  return num(designDryBulbF) - f * num(dailyRangeF, 'nonNegative');
}

export { FACINGS, FACING_AZIMUTH_DEG, type Facing } from './facings';
