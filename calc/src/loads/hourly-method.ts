/**
 * The constants of the hour-by-hour cooling method, each with its source tag. Values that
 * are our own simplification say so ([OWN]); see METHOD_NOTES for the plain-word statement.
 */

/**
 * Heat storage of transmitted sun (a room's furnishings and floor absorb it and give it to
 * the air over the next hours). Gaugeline simplification of the radiant time series (RTS)
 * method of ASHRAE Handbook—Fundamentals 2013 ch. 18 (Spitler, Fisher and Pedersen 1997):
 * transmitted solar is taken as wholly radiant and reaches the cooling load through a
 * 24-term periodic series r_j = (1 − p)·p^j, normalised to sum to 1, with p = 0.5 — about
 * half in the hour it arrives, as the handbook's light-construction solar RTS give
 * [MEM: ch. 18 representative solar RTS for light wood-frame construction, verify].
 */
export const SOLAR_RTS_RATIO = 0.5;
export const SOLAR_RTS: readonly number[] = (() => {
  const raw: number[] = [];
  for (let j = 0; j < 24; j += 1) raw.push((1 - SOLAR_RTS_RATIO) * SOLAR_RTS_RATIO ** j);
  const sum = raw.reduce((a, b) => a + b, 0);
  return raw.map((r) => r / sum);
})();
export const SOLAR_STORAGE_SOURCE =
  '[OWN simplification of the ASHRAE ch. 18 radiant time series: r_j = ½ · ½^j; MEM: light-construction solar RTS]';

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
 * sol-air temperature. [MEM: Threlkeld's decrement-factor/time-lag method as in ASHRAE
 * Fundamentals (pre-2001 ch. 26); light frame ≈ 2 h and 0.9, heavy masonry ≈ 6 h and 0.45 — verify]
 */
export const MASS_RESPONSE = {
  frame: { lagHours: 2, decrement: 0.9 },
  masonry: { lagHours: 6, decrement: 0.45 },
} as const;
export type MassClass = keyof typeof MASS_RESPONSE;

/**
 * Vented attic air temperature: outdoor + k × (roof sol-air − outdoor), one hour behind the
 * roof; k 0.45 for a vented attic, 0.30 with a radiant barrier under the roof deck.
 * [OWN/TRADE: a stated simplification in place of the flat +30 °F. The vented 0.45 gives a dark-shingle
 * attic at 26.6° N in July a peak 38 °F over outdoor, against 40 °F measured (PUB: Parker, Sonne and
 * Sherwin, FSEC-CR-1220-00, control home, Ft. Myers) — checked in tests/calc/method-constants.test.ts;
 * the 1 h lag is inside the 1–2 h delay measured by the USDA Forest Products Laboratory (PUB: TenWolde,
 * FPL-RP-561). The radiant-barrier 0.30 is from memory: no citable source found (issue 9, 5 Dec 2026).]
 */
export const ATTIC_RESPONSE = { vented: 0.45, radiantBarrier: 0.3, lagHours: 1 } as const;

/**
 * Design air leakage in summer as a fraction of the winter rate (less stack effect, lighter
 * design wind). [TRADE/MEM: residential tightness tables give summer rates about half the
 * winter ones] The tightness table's ACH is the winter figure. (The ASHRAE ch. 16 stack-and-wind
 * model Q = A_L·√(C_s·ΔT + C_w·U²) with its one-storey coefficients gives about 0.53 for 20 °F / 7.5 mph
 * against 60 °F / 15 mph — but those coefficients are recalled too [MEM], so no source is claimed.)
 */
export const SUMMER_LEAKAGE_FRACTION = 0.5;

/**
 * Blower-door conversion: natural winter ACH = ACH50 / N with N = 20, ACH50 = CFM50 × 60 / volume.
 * [TRADE: the "N-factor" rule of thumb, trade-facts §5]
 */
export const BLOWER_DOOR_N = 20;

/**
 * Default internal gains of the whole home when no room has people or appliances entered:
 * sensible 464 + 0.7·A_cf + 75·N_oc, latent 68 + 0.07·A_cf + 41·N_oc Btu/h, N_oc = bedrooms + 1.
 * [MEM: ASHRAE Fundamentals ch. 17 RLF internal gains; trade-facts §3 check 3.4]
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
 * SHGC at an angle of incidence θ, as a fraction of the label (normal-incidence) SHGC, at
 * θ = 0, 40, 50, 60, 70, 80, 90°, linear between; diffuse (sky and ground) sun uses the
 * hemispherical ratio. Applied to every glazing type (shape of clear double glazing).
 * [MEM: ASHRAE Handbook—Fundamentals ch. 15 Table 10, angular SHGC of double clear glazing
 * (ID 5a): 0.76, 0.74, 0.71, 0.64, 0.50, 0.26, 0 and hemispherical 0.66 — verify]. Shape checked in
 * tests/calc/method-constants.test.ts: each ratio within 0.05 of (and not above) the Fresnel transmittance
 * ratio of two clear panes [PUB: Duffie and Beckman, Solar Engineering of Thermal Processes, ch. 5];
 * the digits stay from memory.
 */
export const SHGC_ANGLE_DEG: readonly number[] = [0, 40, 50, 60, 70, 80, 90];
export const SHGC_ANGLE_RATIO: readonly number[] = [1, 0.974, 0.934, 0.842, 0.658, 0.342, 0];
export const SHGC_DIFFUSE_RATIO = 0.868;

/** Angular SHGC ratio for an angle of incidence θ (degrees). */
export function shgcAngleRatio(thetaDeg: number): number {
  if (!(thetaDeg > 0)) return 1;
  if (thetaDeg >= 90) return 0;
  for (let i = 1; i < SHGC_ANGLE_DEG.length; i += 1) {
    const hi = SHGC_ANGLE_DEG[i] ?? 90;
    if (thetaDeg <= hi) {
      const lo = SHGC_ANGLE_DEG[i - 1] ?? 0;
      const a = SHGC_ANGLE_RATIO[i - 1] ?? 1;
      const b = SHGC_ANGLE_RATIO[i] ?? 0;
      return a + ((b - a) * (thetaDeg - lo)) / (hi - lo);
    }
  }
  return 0;
}
