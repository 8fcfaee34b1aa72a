import { num } from '../errors';

/**
 * Heat loss of basement walls and floors below grade by the ASHRAE Handbook—Fundamentals method
 * (2009–2017 editions, ch. 18 "Below-grade surfaces"; from Latta and Boileau's circular heat-flow
 * paths through the soil): heat from a point of the wall at depth z reaches the ground surface along a
 * quarter circle of length π·z/2, so U(z) = 1 / (R_other + π·z / (2·k_soil)). Averaged over the depth
 * z1…z2 this gives
 *   U_avg,bw = 2·k/(π·(z2 − z1)) · [ln(z2 + 2·k·R/π) − ln(z1 + 2·k·R/π)]
 * and for a basement floor of shortest width w at depth z_f
 *   U_avg,bf = 2·k/(π·w) · [ln(w/2 + z_f/2 + k·R/π) − ln(z_f/2 + k·R/π)].
 * Heat loss q = U_avg · A · (t_in − t_gr), with t_gr the design ground surface temperature (the
 * site's annual mean less the ground surface amplitude). No cooling gain below grade: the ground
 * is cooler than the room in summer. [MEM: ASHRAE Handbook—Fundamentals ch. 18 below-grade
 * equations — the wall form is checked in the tests by integrating U(z) numerically and against the
 * older tabulated per-foot values. Assumption (no published source found): the floor form, recalled. It is
 * the average over the half-width of U(x) = 1/(R_other + π·(x + z_f/2)/k) — heat from a floor point x from
 * the nearest wall along a half circle of radius x + z_f/2 — which tests/calc/method-constants.test.ts
 * checks by integrating; that path model is the recalled part. No effect on the review ranch (slab on grade).]
 */
export const BELOW_GRADE_SOURCE =
  'ASHRAE Handbook—Fundamentals ch. 18 below-grade walls and floors (circular heat-flow paths, Latta and Boileau) [MEM]';

/**
 * Soil conductivity, Btu/h·ft·°F. [MEM: the handbook's basis value 0.8 for the below-grade tables, verify]
 * It lies inside the published range for soils, 0.3–1.4 Btu/h·ft·°F (0.5–2.5 W/m·K) by composition and
 * moisture [PUB: "Heat Loss from Basement Walls and Floors", engineer-educators.com/topic/7-heat-loss-from-
 * basement-walls-and-floors, a heat-transfer course text], which the tests check; the exact figure stays from memory.
 */
export const SOIL_CONDUCTIVITY = 0.8;

/** Average U of a below-grade wall between depths z1 and z2 (ft, z2 > z1 ≥ 0), R_other the wall's own resistance. */
export function belowGradeWallU({ z1Ft, z2Ft, rOther }: { z1Ft: number; z2Ft: number; rOther: number }): number {
  num(z1Ft, 'nonNegative');
  num(z2Ft, 'positive');
  num(rOther, 'nonNegative');
  if (!(z2Ft > z1Ft)) return 0;
  const k = SOIL_CONDUCTIVITY;
  const a = (2 * k * rOther) / Math.PI;
  return ((2 * k) / (Math.PI * (z2Ft - z1Ft))) * (Math.log(z2Ft + a) - Math.log(z1Ft + a));
}

/** Average U of a basement floor of shortest width `widthFt` at `depthFt` below grade, R_other its own resistance. */
export function basementFloorU({
  widthFt,
  depthFt,
  rOther,
}: {
  widthFt: number;
  depthFt: number;
  rOther: number;
}): number {
  num(widthFt, 'positive');
  num(depthFt, 'nonNegative');
  num(rOther, 'nonNegative');
  num(depthFt + rOther, 'positive'); // a floor at grade with no resistance has no finite average
  const k = SOIL_CONDUCTIVITY;
  const b = (k * rOther) / Math.PI;
  return ((2 * k) / (Math.PI * widthFt)) * (Math.log(widthFt / 2 + depthFt / 2 + b) - Math.log(depthFt / 2 + b));
}

/** Resistance of a bare concrete basement floor with its inside film. [MEM: ASHRAE ch. 26 — 4 in concrete ≈, still-air film heat flow down 0.92 (trade-facts §2)] */
export const BASEMENT_FLOOR_BASE_R = 1.2;
