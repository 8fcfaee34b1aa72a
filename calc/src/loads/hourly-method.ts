import type { InteriorShadingKey } from '../construction-defaults';
import { THERMAL_MASS_CLASSES, type ThermalMass } from '../schemas/home';

/**
 * The constants of the hour-by-hour cooling method, each with its source tag. Values that
 * are our own simplification say so ([OWN]); see METHOD_NOTES for the plain-word statement.
 */

/**
 * Heat storage in the room: the radiant time series (RTS) method of ASHRAE Handbook—Fundamentals ch. 18
 * (Spitler, Fisher and Pedersen, "The Radiant Time Series Cooling Load Calculation Procedure", ASHRAE
 * Transactions 103(2), 1997). Each hour's heat gain is split into a convective part, which is cooling load
 * in that hour, and a radiant part, which the room's surfaces and furnishings absorb and give to the air
 * over the next 24 hours: cooling load Q_c(h) = Σ_j r_j·q_r(h − j), the r_j the radiant time factors. The
 * design day repeats (a periodic day), so the series wraps round midnight and the day's cooling load adds
 * up to the day's heat gain. Transmitted beam sun falls on the floor and uses the solar factors; every other
 * radiant gain (diffuse sun, conduction) is spread over all surfaces and uses the nonsolar factors.
 *
 * The factors, in per cent, for each construction class, the columns "with carpet, 10 % glass" (a home's
 * glass is nearer a tenth of its outside wall than half), hours 0–23:
 * [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 18, Table 19 "Representative Nonsolar RTS Values for Light to
 * Heavy Construction" and Table 20 "Representative Solar RTS Values for Light to Heavy Construction", read
 * 5 Dec 2026 through two public reproductions in open-source building-energy code that agree where they
 * overlap: OpenStudio's heat-transfer measure library (os_lib_heat_transfer.rb, Alliance for Sustainable
 * Energy, "from ASHRAE HOF 2013/2021 Chapter 18 Tables 19 and 20, Medium Construction, 50% glass, with
 * carpet") and a Python RTS module that embeds both whole tables ("ASHRAE Fundamentals 2021, Chapter 18,
 * Tables 19 and 20"). tests/calc/radiant-time-series.test.ts checks that every column sums to 100.]
 */
export const RTS_CONSTRUCTIONS = THERMAL_MASS_CLASSES;
export type RtsConstruction = ThermalMass;
/**
 * The construction class when the house has none chosen (its `thermalMass`). [OWN: the middle of the table. The
 * handbook's classes are made of particular wall, floor and ceiling layers (MEM: light a framed wall over a thin
 * floor; medium a brick-veneer wall over a 4 in concrete floor; heavy 8 in concrete walls and floors); the house
 * descriptions the walk-through offers for them are our own reading.]
 */
export const DEFAULT_RTS_CONSTRUCTION: RtsConstruction = 'medium';

export const NONSOLAR_RTS_PERCENT: Readonly<Record<RtsConstruction, readonly number[]>> = {
  light: [47, 19, 11, 6, 4, 3, 2, 2, 1, 1, 1, 1, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0],
  medium: [46, 18, 10, 6, 4, 2, 2, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 0, 0, 0, 0, 0],
  heavy: [34, 9, 6, 4, 4, 4, 3, 3, 3, 3, 3, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 1, 1],
};
export const SOLAR_RTS_PERCENT: Readonly<Record<RtsConstruction, readonly number[]>> = {
  light: [53, 17, 9, 5, 3, 2, 2, 1, 1, 1, 1, 1, 1, 1, 1, 1, 0, 0, 0, 0, 0, 0, 0, 0],
  medium: [52, 16, 8, 5, 3, 2, 2, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 0, 0, 0, 0, 0],
  heavy: [47, 11, 6, 4, 3, 2, 2, 2, 2, 2, 2, 2, 2, 2, 2, 1, 1, 1, 1, 1, 1, 1, 1, 1],
};

/**
 * The radiant part of each heat gain (the rest is convective, cooling load at once).
 * [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 18, Table 14 "Recommended Radiative/Convective Splits for
 * Internal Heat Gains", read through the same Python reproduction: conduction through walls and floors 0.46,
 * through the roof 0.60, through windows 0.33 when the SHGC is over 0.5 and 0.46 when under; transmitted sun
 * with no interior shading 1.0; air leakage and ventilation 0 (all convective).]
 * Sun through glass behind an interior shade: the current handbook gives no single split. Its rule is that
 * the whole solar gain through a window with an interior shading device — beam and diffuse alike, after
 * SHGC × IAC — is split by the radiant fraction FR printed beside that shade's IAC in the interior-shading
 * tables of the fenestration chapter, so FR depends on the kind of shade (and its colour, weave or slat
 * angle); an unshaded window's transmitted sun is 1.0 radiant.
 * [PUB: ASHRAE Handbook—Fundamentals 2017 ch. 15 §5.2 and Tables 14A to 14G (the radiative fraction printed
 * beside each interior shading device's IAC, applied to beam and diffuse alike; 1.0 with no shade), as the
 * table rows are reproduced in public open-source code read 5 Dec 2026.]
 * `sunInteriorShade` 0.63 is kept only as the from-memory stand-in for drapes, whose FR was not found;
 * SHADED_SUN_RADIANT_FRACTION below gives each shade choice its own figure. A shade absorbs the beam and gives it
 * off as it would any other gain, so shaded glass uses the nonsolar factors.
 */
export const RADIANT_FRACTION = {
  wallsAndFloors: 0.46,
  roof: 0.6,
  windowsShgcOverHalf: 0.33,
  windowsShgcUnderHalf: 0.46,
  sunUnshaded: 1,
  /**
   * [MEM: a single shaded-glass figure recalled from the radiative/convective table of ASHRAE Fundamentals 2001
   * ch. 29 — recalled, not seen, and which row it is (sun through glass with a shade, or sun absorbed by the
   * glass) is itself unverified. Searched 5 Dec 2026 for the per-shade FR column: public code, building-simulation
   * documentation and pages for ch. 15 Tables 14A–14G, "interior attenuation coefficient" with "radiant
   * fraction", the Load Calculation Applications Manual, and the split table's shaded-glass row.]
   */
  sunInteriorShade: 0.63,
} as const;

/** The interior shades a window can have (every choice but 'none'). */
export type ShadeKind = Exclude<InteriorShadingKey, 'none'>;
export const SHADE_KINDS: readonly ShadeKind[] = ['blinds', 'drapes', 'shades'];

/**
 * The radiant part of the sun through glass behind each interior shade (beam and diffuse alike), the FR of the
 * rule above.
 * - shades 0.44 [PUB: the roller-shade row of ASHRAE Handbook—Fundamentals 2017 ch. 15 (Tables 14A–14G):
 *   dark opaque roller shades on double clear glass 5a, IAC 0.76, radiant fraction 0.44, read 5 Dec 2026 in a
 *   public reproduction of the table rows. The row's IAC agrees with the residential chapter's consolidated
 *   table (dark opaque roller shade on double clear glass 0.76, as reproduced in a public copy of ch. 17
 *   Table 14), which ties the row to the handbook; our 'Shades' IAC is the dark-shade line of the same table,
 *   which over double clear glass gives that 0.76 (INTERIOR_SHADING_IAC).]
 * - blinds 0.71 [PUB: the one published blind row found, in the same tables: louvered shade, louver reflectance
 *   0.5, on double clear glass, IAC 0.98 at normal incidence, 0.80 at 60°, 0.89 diffuse, FR 0.71 (ASHRAE 2017
 *   ch. 15 Tables 14A–14G, the same public reproduction), read 5 Dec 2026. It is the open-slat row; our
 *   'Blinds' are the half-open medium blinds of INTERIOR_SHADING_IAC, whose FR was not found — this is the nearest
 *   published blind row, chosen over the 0.63 recalled figure.]
 * - drapes 0.63 [MEM: the stand-in above; no published drapery FR was found in a public copy (searched 5 Dec 2026:
 *   public code and pages for ch. 15 Table 14G, draperies with "radiant fraction", ASHWAT and 1311-RP code). The
 *   loads page and the shade picker say so.]
 */
export const SHADED_SUN_RADIANT_FRACTION: Readonly<Record<ShadeKind, number>> = {
  blinds: 0.71,
  drapes: RADIANT_FRACTION.sunInteriorShade,
  shades: 0.44,
};

/** The radiant part of a window's conduction gain by its SHGC (Table 14: over 0.5 → 0.33, else 0.46). */
export function windowConductionRadiantFraction(shgc: number): number {
  return shgc > 0.5 ? RADIANT_FRACTION.windowsShgcOverHalf : RADIANT_FRACTION.windowsShgcUnderHalf;
}

export const RTS_SOURCE =
  '[PUB: ASHRAE Handbook—Fundamentals 2021 ch. 18, radiant time series: Tables 19 and 20 representative RTS values, with carpet, 10 % glass; Table 14 radiative/convective splits]';

/**
 * Sol-air temperature: T_e = T_o + (α/h_o)·E_t − ε·ΔR/h_o. α/h_o in h·ft²·°F/Btu: light 0.15,
 * dark 0.30 (medium halfway); ε·ΔR/h_o = 7 °F for horizontal surfaces, 0 for walls.
 * [PUB: ASHRAE Fundamentals ch. 18 sol-air temperature; the same values in SI, 0.026 and
 * 0.052 m²·K/W, are in trade-facts §3a (× 5.678 = 0.148 and 0.295)]
 */
export const SOL_AIR_ALPHA_OVER_HO = { light: 0.15, medium: 0.225, dark: 0.3 } as const;
export const SOL_AIR_HORIZONTAL_LONGWAVE_F = 7;

/**
 * Time lag and damping of opaque walls, roofs and doors (decrement-factor method): the heat
 * reaching the room at hour h is U·A·[(T̄e − Ti) + λ·(Te(h − δ) − T̄e)], T̄e the daily mean
 * sol-air temperature. The lag δ (whole hours) and decrement λ are those of the exact periodic
 * (24 h) conduction solution through the layers of a representative wall — each layer's transfer
 * matrix [[cosh γL, sinh γL/(kγ)], [kγ·sinh γL, cosh γL]], γ = √(iω/α), with the surface films in
 * series; λ = U_dynamic/U and δ = the phase of the air-to-air transmittance — using the material
 * properties the Oak Ridge National Laboratory published for its wall studies [PUB: Kosny et al.,
 * "Dynamic Thermal Performance and Energy Benefits of Using Massive Walls in Residential Buildings",
 * ORNL, Table 3: concrete k 1.44 W/m·K, ρ 2240 kg/m³, c 0.84 kJ/kg·K; insulating foam 0.036, 25.6, 1.21;
 * gypsum board 0.16, 800, 1.09; stucco 0.72, 1856, 0.84]. Frame: ⅞ in stucco, R-13 of insulation,
 * ½ in gypsum → 1.3 h and 0.98 (taken as 1 h and 0.98); masonry: 8 in concrete and ½ in gypsum →
 * 5.9 h and 0.50 (6 h and 0.50). tests/calc/method-constants.test.ts works both. [Assumption (no
 * published source found): the make-up of the two representative walls and the films (outside
 * 0.044, inside 0.12 m²·K/W, MEM: ASHRAE ch. 26); a sided frame wall lags less than a stuccoed one.]
 */
export const MASS_RESPONSE = {
  frame: { lagHours: 1, decrement: 0.98 },
  masonry: { lagHours: 6, decrement: 0.5 },
} as const;
export type MassClass = keyof typeof MASS_RESPONSE;

/**
 * Peak attic air in two side-by-side Florida attics under black shingles, both vented 1 in 300, one with
 * a radiant barrier, on a typical mid-June day with a 92 °F peak outdoors: 134.9 °F without the barrier,
 * 128.1 °F with it. [PUB: Parker and Sherwin, "Comparative Summer Attic Thermal Performance of Six Roof
 * Constructions", Florida Solar Energy Center, 1998 — as tabulated in the summary at
 * https://www.builditsolar.com/Projects/Cooling/FSECRoofPaperSummary.htm (read 5 Dec 2026; the paper itself
 * was not found in a public copy), which gives the barrier's cut of the attic-to-living-space difference as 12 %.]
 */
export const FSEC_RADIANT_BARRIER_ATTICS = { outdoorPeakF: 92, withoutBarrierF: 134.9, withBarrierF: 128.1 } as const;

/**
 * Vented attic air temperature: outdoor + k × (roof sol-air − outdoor), one hour behind the
 * roof; k 0.45 for a vented attic; with a radiant barrier under the roof deck, k × the measured
 * ratio of the two attics' excess over outdoor air, (128.1 − 92)/(134.9 − 92) = 0.842 → 0.379.
 * [OWN/TRADE: a stated simplification in place of the flat +30 °F. The vented 0.45 gives a dark-shingle
 * attic at 26.6° N in July a peak 38 °F over outdoor, against 40 °F measured (PUB: Parker, Sonne and
 * Sherwin, FSEC-CR-1220-00, control home, Ft. Myers) — checked in tests/calc/method-constants.test.ts;
 * the 1 h lag is inside the 1–2 h delay measured by the USDA Forest Products Laboratory (PUB: TenWolde,
 * FPL-RP-561).] [PUB, the radiant barrier: FSEC_RADIANT_BARRIER_ATTICS. The model's attic excess over outdoor
 * is proportional to k at every hour, so the measured ratio carries over whatever the site. The barrier then
 * cuts a dark roof's peak-hour ceiling gain by about 11 %, under the lowest peak-hour cut of ceiling heat
 * flux, 23 %, that Medina and Young simulated for R-19 attics (PUB: "A perspective on the effect of climate
 * and local environmental variables on the performance of attic radiant barriers in the United States",
 * Building and Environment 41 (2006) 1767–1778) — the barrier's cut of the radiation reaching the insulation
 * is not modelled apart from the attic air, so the ceiling credit is on the low side; both checked in the
 * same test file.]
 */
export const ATTIC_RESPONSE = {
  vented: 0.45,
  radiantBarrier:
    (0.45 * (FSEC_RADIANT_BARRIER_ATTICS.withBarrierF - FSEC_RADIANT_BARRIER_ATTICS.outdoorPeakF)) /
    (FSEC_RADIANT_BARRIER_ATTICS.withoutBarrierF - FSEC_RADIANT_BARRIER_ATTICS.outdoorPeakF),
  lagHours: 1,
} as const;

/**
 * Default internal gains of the whole home when no room has people or appliances entered:
 * sensible 464 + 0.7·A_cf + 75·N_oc, latent 68 + 0.07·A_cf + 41·N_oc Btu/h, N_oc = bedrooms + 1.
 * [PUB: ASHRAE Handbook—Fundamentals ch. 17 (RLF method, "Internal Gain") eqs. (30) and (31), in the 2021 SI
 * edition q_ig,s = 136 + 2.2·A_cf + 22·N_oc and q_ig,l = 20 + 0.22·A_cf + 12·N_oc W (A_cf in m²), "number of
 * occupants (if unknown, estimate as N_br + 1)" — read in a copy of the 2021 SI chapter in a public repository;
 * the SI form is also in a public university assignment implementing the RLF method. The IP coefficients here
 * are the SI ones converted, which tests/calc/infiltration.test.ts checks.]
 */
export const RLF_INTERNAL = {
  sensibleBase: 464,
  sensiblePerFt2: 0.7,
  sensiblePerOccupant: 75,
  latentBase: 68,
  latentPerFt2: 0.07,
  latentPerOccupant: 41,
} as const;

/** Garage temperature as a fraction of the way from indoor to outdoor each hour. [TRADE, as before] */
export const GARAGE_COOLING_FRACTION = 0.6;

/** Default ERV/HRV sensible effectiveness when none is entered. [TRADE: typical rated 0.6–0.8; conservative 0.6] */
export const DEFAULT_RECOVERY_SENSIBLE = 0.6;

/**
 * How the SHGC falls off with the angle of incidence θ, as a fraction of the label (normal-incidence)
 * SHGC: the solar transmittance of two clear panes at θ over that at 0°, from the physics of the glass
 * (no recalled table). Each air–glass surface reflects by Fresnel's equations (Snell's law for the
 * refraction angle θr, sin θ = n·sin θr; perpendicular and parallel polarisation averaged):
 *   r⊥ = sin²(θr − θ)/sin²(θr + θ),  r∥ = tan²(θr − θ)/tan²(θr + θ)
 * N parallel panes with the inter-reflections between them transmit, by reflection alone,
 *   τr = ½·[(1 − r∥)/(1 + (2N − 1)·r∥) + (1 − r⊥)/(1 + (2N − 1)·r⊥)]
 * and absorb along the slanted path, τa = exp(−N·K·L / cos θr).
 * [PUB: the Fresnel equations; the N-cover and absorption forms of Duffie and Beckman, Solar Engineering
 * of Thermal Processes (Wiley), ch. 5 "Radiation transmission through glazing"; the refractive index
 * n = 1.525 of soda-lime window glass at 0.55 µm from Rubin's dispersion fit n = 1.5130 − 0.003169·λ² +
 * 0.003962·λ⁻² (M. Rubin, "Optical properties of soda lime silica glasses", Solar Energy Materials 12
 * (1985) 275–288, LBL-13572; refractiveindex.info "soda-lime glass"), which the tests check.]
 * [Assumption (no published source found): K·L = 0.03 per clear pane; the ratio at 60° moves by less
 * than 0.015 either way between K·L 0 and 0.06, which the tests check.] The transmittance ratio stands for the SHGC
 * ratio: the inward-flowing absorbed part of clear glass is small. Applied to every glazing type (the
 * shape of clear double glazing). Diffuse (sky and ground) sun uses the hemispherical average
 * 2·∫ τ(θ)/τ(0)·cos θ·sin θ dθ over 0–90° [PUB: isotropic diffuse, the same chapter].
 */
export const GLASS_REFRACTIVE_INDEX = 1.525;
export const GLASS_KL_PER_PANE = 0.03;
export const GLASS_PANES_FOR_ANGLE = 2;

/** Solar transmittance of `panes` parallel clear panes at angle of incidence θ (degrees), Fresnel optics. */
export function glassTransmittance(
  thetaDeg: number,
  panes: number = GLASS_PANES_FOR_ANGLE,
  n: number = GLASS_REFRACTIVE_INDEX,
  klPerPane: number = GLASS_KL_PER_PANE,
): number {
  if (!(thetaDeg < 90)) return 0;
  const t = (Math.max(0, thetaDeg) * Math.PI) / 180;
  let rPar: number;
  let rPerp: number;
  let cosR = 1;
  if (t < 1e-6) {
    rPar = rPerp = ((n - 1) / (n + 1)) ** 2;
  } else {
    const tr = Math.asin(Math.sin(t) / n);
    cosR = Math.cos(tr);
    rPerp = Math.sin(tr - t) ** 2 / Math.sin(tr + t) ** 2;
    rPar = Math.tan(tr - t) ** 2 / Math.tan(tr + t) ** 2;
  }
  const k = 2 * panes - 1;
  const tauR = 0.5 * ((1 - rPar) / (1 + k * rPar) + (1 - rPerp) / (1 + k * rPerp));
  return tauR * Math.exp((-panes * klPerPane) / cosR);
}

const GLASS_NORMAL_TRANSMITTANCE = glassTransmittance(0);

/** Angular SHGC ratio for an angle of incidence θ (degrees): τ(θ)/τ(0) of two clear panes. */
export function shgcAngleRatio(thetaDeg: number): number {
  if (!(thetaDeg > 0)) return 1;
  if (thetaDeg >= 90) return 0;
  return glassTransmittance(thetaDeg) / GLASS_NORMAL_TRANSMITTANCE;
}

/** Hemispherical (diffuse) ratio: 2·∫ ratio(θ)·cos θ·sin θ dθ, midpoint rule over 0.1° steps. */
export const SHGC_DIFFUSE_RATIO = (() => {
  const steps = 900;
  const d = Math.PI / 2 / steps;
  let s = 0;
  for (let i = 0; i < steps; i += 1) {
    const t = (i + 0.5) * d;
    s += shgcAngleRatio((t * 180) / Math.PI) * Math.cos(t) * Math.sin(t) * d;
  }
  return 2 * s;
})();
