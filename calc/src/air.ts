import { num } from './errors';

/**
 * Sensible-heat constant for standard air, Btu/h per CFM·°F:
 * 0.075 lb/ft³ × 60 min/h × 0.24 Btu/lb·°F = 1.08. [PUB: engineeringtoolbox / insightusa derivation]
 * (ASHRAE's 1.10 for moist air is the alternative; calc declares 1.08.)
 */
export const SENSIBLE_CONSTANT = 1.08;
/**
 * Latent-heat constant, Btu/h per CFM·grain/lb: 60 × 0.075 × 1061 / 7000 ≈ 0.68.
 * [PUB: engineeringtoolbox cooling-heating equations; MEM: ACCA Manual J 8th ed. §8]
 */
export const LATENT_CONSTANT = 0.68;

/** Sensible heat of an air stream, Btu/h = 1.08 × CFM × ΔT(°F). Standard air; no rounding. */
export function sensibleHeatBtuh({ cfm, deltaTF }: { readonly cfm: number; readonly deltaTF: number }): number {
  return SENSIBLE_CONSTANT * num(cfm, 'nonNegative') * num(deltaTF);
}

/** Latent heat of an air stream, Btu/h = 0.68 × CFM × Δgr (grains/lb). Standard air; no rounding. */
export function latentHeatBtuh({ cfm, deltaGrains }: { readonly cfm: number; readonly deltaGrains: number }): number {
  return LATENT_CONSTANT * num(cfm, 'nonNegative') * num(deltaGrains);
}

/** Air-change infiltration, CFM = ACH × volume(ft³) / 60. [PUB: air-change method] No rounding. */
export function infiltrationCfm({ volumeFt3, ach }: { readonly volumeFt3: number; readonly ach: number }): number {
  return (num(ach, 'nonNegative') * num(volumeFt3, 'nonNegative')) / 60;
}

/**
 * Supply airflow to carry a sensible load, CFM = Q_s / (1.08 × supply ΔT). [TRADE; PUB
 * (secondary): Manual S 2nd ed. description] No rounding.
 */
export function airflowForSensibleCfm({
  sensibleBtuh,
  supplyDeltaTF,
}: {
  readonly sensibleBtuh: number;
  readonly supplyDeltaTF: number;
}): number {
  return num(sensibleBtuh, 'nonNegative') / (SENSIBLE_CONSTANT * num(supplyDeltaTF, 'positive'));
}

/** Whole-house mechanical ventilation, CFM = 0.03 × floor ft² + 7.5 × (bedrooms + 1). [MEM: ASHRAE 62.2-2013] */
export function ventilationCfm62_2({
  floorAreaFt2,
  bedrooms,
}: {
  readonly floorAreaFt2: number;
  readonly bedrooms: number;
}): number {
  return 0.03 * num(floorAreaFt2, 'nonNegative') + 7.5 * (num(bedrooms, 'nonNegativeInteger') + 1);
}

/**
 * Natural ACH from a blower-door ACH50 result, ACH50 / N with N ≈ 20 — an empirical estimate that ignores the
 * weather [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 16 "Empirical Models": ACH at 50 Pa "divided by a constant
 * approximately equal to 20 (Sherman 1987)"]. The load method does not use it (infiltration.ts).
 */
export function naturalAchFromAch50({ ach50, n = 20 }: { readonly ach50: number; readonly n?: number }): number {
  return num(ach50, 'nonNegative') / num(n, 'positive');
}

/** Condensate from a latent load, lb/h = latent Btu/h ÷ 1,060 Btu/lb. [PUB: engineeringtoolbox h_we; ACCA blog] */
export function condensateLbPerHour({ latentBtuh }: { readonly latentBtuh: number }): number {
  return num(latentBtuh, 'nonNegative') / 1060;
}

/** Condensate, US gal/h = lb/h ÷ 8.34 lb/gal. [PUB: water density ≈ 8.34 lb/gal] */
export function condensateGalPerHour({ latentBtuh }: { readonly latentBtuh: number }): number {
  return condensateLbPerHour({ latentBtuh }) / 8.34;
}
