/**
 * Construction defaults — the one table of assumed envelope values, each with its
 * source tag from the project's trade-facts reference. Users override any of them with
 * label/spec values (NFRC U and SHGC, measured ACH). Tags: [PUB …] published,
 * [MEM …] from memory (verify), [TRADE] common practice, [OWN] own arithmetic.
 */

export interface Sourced<T> {
  readonly value: T;
  readonly label: string;
  readonly source: string;
}

/** Whole-assembly wall U-factors, Btu/h·ft²·°F. */
export const WALL_CONSTRUCTIONS = {
  'wood-2x4-r13': {
    value: 0.083,
    label: '2×4 wood frame, R-13 batt',
    source: '[OWN] parallel-path worked example (U 0.0829); [MEM: IECC R402.1.2 equivalent U 0.084]',
  },
  'wood-2x6-r19': {
    value: 0.06,
    label: '2×6 wood frame, R-19/R-20 batt',
    source: '[MEM: IECC R402.1.2 equivalent U 0.060]',
  },
  'wood-2x4-uninsulated': {
    value: 0.24,
    label: '2×4 wood frame, empty cavity',
    source: '[OWN] parallel path with a ≈ R-1 cavity air space [MEM: ASHRAE ch. 26]',
  },
  'masonry-uninsulated': {
    value: 0.35,
    label: 'Solid masonry, no insulation',
    source: '[MEM: ASHRAE Fundamentals ch. 26 typical masonry]',
  },
  'masonry-r10-furred': {
    value: 0.08,
    label: 'Masonry with R-10 furred interior',
    source: '[MEM: IECC mass-wall equivalent U ≈ 0.08]',
  },
} as const satisfies Record<string, Sourced<number>>;
export type WallConstructionKey = keyof typeof WALL_CONSTRUCTIONS;

/** Ceiling/roof U-factor by insulation level, Btu/h·ft²·°F (attic floor or insulated roof deck). */
export const CEILING_INSULATION = {
  none: {
    value: 0.6,
    label: 'No insulation',
    source: '[OWN] ½ in gypsum + two still-air films (0.61 + 0.45 + 0.61 → U 0.60) [MEM: ASHRAE ch. 26 films]',
  },
  r11: { value: 0.083, label: 'R-11', source: '[MEM: ASHRAE ch. 26 typical, verify]' },
  r19: { value: 0.05, label: 'R-19', source: '[MEM: ASHRAE ch. 26 typical, verify]' },
  r30: { value: 0.035, label: 'R-30', source: '[MEM: IECC R402.1.2 equivalent U 0.035]' },
  r38: { value: 0.03, label: 'R-38', source: '[MEM: IECC R402.1.2 equivalent U 0.030]' },
  r49: { value: 0.026, label: 'R-49', source: '[MEM: IECC R402.1.2 equivalent U 0.026]' },
  r60: { value: 0.024, label: 'R-60', source: '[MEM: IECC R402.1.2 equivalent U 0.024]' },
} as const satisfies Record<string, Sourced<number>>;
export type CeilingInsulationKey = keyof typeof CEILING_INSULATION;

/** Framed-floor U-factor by insulation level (over crawl space, garage, unconditioned basement). */
export const FLOOR_INSULATION = {
  none: { value: 0.25, label: 'No insulation', source: '[MEM: ASHRAE ch. 26 typical framed floor, verify]' },
  r13: { value: 0.064, label: 'R-13', source: '[MEM: IECC equivalent U, verify]' },
  r19: { value: 0.047, label: 'R-19', source: '[MEM: IECC R402.1.2 equivalent U 0.047]' },
  r30: { value: 0.033, label: 'R-30', source: '[MEM: IECC R402.1.2 equivalent U 0.033]' },
} as const satisfies Record<string, Sourced<number>>;
export type FloorInsulationKey = keyof typeof FLOOR_INSULATION;

/** Slab-on-grade edge F-factor, Btu/h·ft(perimeter)·°F. Heating only. */
export const SLAB_EDGE = {
  uninsulated: { value: 0.73, label: 'Uninsulated slab edge', source: '[MEM: ASHRAE 90.1 / IECC F-factor 0.73]' },
  insulated: { value: 0.54, label: 'R-10 slab-edge insulation', source: '[MEM: ASHRAE 90.1 / IECC F-factor ≈ 0.54]' },
} as const satisfies Record<string, Sourced<number>>;

/** Glazing defaults: whole-window U and SHGC. Override with the NFRC label. */
export const GLAZING_TYPES = {
  'single-clear': {
    value: { u: 1.04, shgc: 0.76 },
    label: 'Single pane, clear',
    source: '[MEM: ASHRAE Fundamentals ch. 15 fenestration tables]',
  },
  'double-clear': {
    value: { u: 0.55, shgc: 0.67 },
    label: 'Double pane, clear',
    source: '[MEM: ASHRAE Fundamentals ch. 15; U range 0.45–0.80]',
  },
  'double-low-e': {
    value: { u: 0.3, shgc: 0.3 },
    label: 'Double pane, low-e, argon',
    source: '[MEM: ASHRAE ch. 15 U 0.25–0.32; PUB: IECC SHGC ≤ 0.25 zones 1–3 is stricter]',
  },
  'triple-low-e': {
    value: { u: 0.2, shgc: 0.25 },
    label: 'Triple pane, low-e',
    source: '[MEM: ASHRAE Fundamentals ch. 15, verify]',
  },
} as const satisfies Record<string, Sourced<{ u: number; shgc: number }>>;
export type GlazingTypeKey = keyof typeof GLAZING_TYPES;

/** Door U-factors, Btu/h·ft²·°F. */
export const DOOR_TYPES = {
  'wood-solid': { value: 0.4, label: 'Solid-core wood, 1¾ in', source: '[MEM: ASHRAE Fundamentals ch. 15 door table]' },
  'insulated-steel': { value: 0.2, label: 'Insulated steel', source: '[MEM: ASHRAE ch. 15, range 0.15–0.30]' },
  fiberglass: { value: 0.25, label: 'Insulated fiberglass', source: '[MEM: ASHRAE ch. 15, range 0.15–0.30]' },
} as const satisfies Record<string, Sourced<number>>;
export type DoorTypeKey = keyof typeof DOOR_TYPES;

/**
 * Envelope tightness in words, as the walk-through offers it: each word is a row of the residential chapter's
 * unit-leakage-area table, and `value` is that row's unit leakage area, cm² of effective leakage area per m² of
 * exposed surface (the load method reads it from UNIT_LEAKAGE_AREA_CM2_PER_M2, loads/infiltration.ts).
 * [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 17 Table 3 "Unit Leakage Areas", the rows' descriptions shortened]
 */
export const INFILTRATION_TIGHTNESS = {
  'very-tight': {
    value: 0.7,
    label: 'Very tight (sealed by an air-sealing specialist)',
    source: '[PUB: ASHRAE Fundamentals 2021 ch. 17 Table 3, "tight"]',
  },
  tight: {
    value: 1.4,
    label: 'Tight (carefully sealed by the builder)',
    source: '[PUB: ASHRAE Fundamentals 2021 ch. 17 Table 3, "good"]',
  },
  average: {
    value: 2.8,
    label: 'Average (typical current production house)',
    source: '[PUB: ASHRAE Fundamentals 2021 ch. 17 Table 3, "average"]',
  },
  leaky: {
    value: 5.6,
    label: 'Leaky (typical pre-1970 house)',
    source: '[PUB: ASHRAE Fundamentals 2021 ch. 17 Table 3, "leaky"]',
  },
  'very-leaky': {
    value: 10.4,
    label: 'Very leaky (old house as built)',
    source: '[PUB: ASHRAE Fundamentals 2021 ch. 17 Table 3, "very leaky"]',
  },
} as const satisfies Record<string, Sourced<number>>;
export type TightnessKey = keyof typeof INFILTRATION_TIGHTNESS;

/**
 * Peak summer irradiance on glass by facing, Btu/h·ft². A documented Gaugeline
 * simplification (one number per compass direction, clear sky near 40° N), not a
 * published factor table. [MEM: ASHRAE Fundamentals ch. 14/15 — west 200–230, north
 * 30–45 diffuse; TRADE: E/W highest, S moderate in summer]
 */
export const PEAK_IRRADIANCE_BTUH_FT2 = {
  N: 40,
  NE: 120,
  E: 200,
  SE: 150,
  S: 100,
  SW: 150,
  W: 215,
  NW: 120,
} as const;
export type CompassDirection = keyof typeof PEAK_IRRADIANCE_BTUH_FT2;
export const IRRADIANCE_SOURCE = '[MEM: ASHRAE Fundamentals ch. 14/15 clear-sky peaks; Gaugeline simplification]';

/**
 * Interior attenuation coefficient (IAC) of an interior shade drawn over the whole window: a straight line in the
 * glazing's SHGC, IAC = c1 − c2 × SHGC (a shade cuts the sun through clear glass more than through glass that
 * already keeps most of it out). [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 15 Table 14 (interior attenuation
 * coefficients), as NREL's OpenStudio-HPXML fits it for ANSI/RESNET/ICC 301-2022 Addendum C
 * (HPXMLtoOpenStudio/resources/defaults.rb, get_window_interior_shading_factors: "C1/C2 coefficients derived from
 * ASHRAE 2021 Handbook of Fundamentals Chapter 15 Table 14"), read 5 Dec 2026. Rows used:
 * blinds = medium blinds half open (c1 0.95, c2 0.26; half open is that source's default position for blinds),
 * drapes = medium curtains (0.94, 0.37), shades = dark shades (0.98, 0.33 — on double clear glass, SHGC 0.67, this
 * gives 0.76, the handbook's dark opaque roller shade whose radiant fraction 0.44 SHADED_SUN_RADIANT_FRACTION uses).]
 * [OWN: the walk-through does not ask the colour, so blinds and drapes take the medium row and shades the dark one;
 * the shade covers the whole window — it is chosen where it is drawn on a hot afternoon.]
 */
export const INTERIOR_SHADING_IAC = {
  none: { value: { c1: 1, c2: 0 }, label: 'None', source: '[PUB: definition, no attenuation]' },
  blinds: {
    value: { c1: 0.95, c2: 0.26 },
    label: 'Blinds',
    source: '[PUB: ASHRAE 2021 ch. 15 Table 14 as fitted by OpenStudio-HPXML: medium blinds, half open]',
  },
  drapes: {
    value: { c1: 0.94, c2: 0.37 },
    label: 'Drapes',
    source: '[PUB: ASHRAE 2021 ch. 15 Table 14 as fitted by OpenStudio-HPXML: medium curtains]',
  },
  shades: {
    value: { c1: 0.98, c2: 0.33 },
    label: 'Shades',
    source: '[PUB: ASHRAE 2021 ch. 15 Table 14 as fitted by OpenStudio-HPXML: dark shades]',
  },
} as const satisfies Record<string, Sourced<{ c1: number; c2: number }>>;

/** The shade choices in words, for the loads page and the shade picker. */
export const SHADE_IAC_NOTE =
  'Interior shading IAC = c1 − c2 × the glass’s SHGC, the line fitted to ASHRAE Handbook—Fundamentals 2021 ch. 15 Table 14 in NREL’s OpenStudio-HPXML: blinds as medium blinds half open (0.95 − 0.26 × SHGC), drapes as medium curtains (0.94 − 0.37 × SHGC), shades as dark shades (0.98 − 0.33 × SHGC), each drawn over the whole window; the colour is not asked.';

/** The IAC of `kind` over glass of solar heat gain coefficient `shgc` (see INTERIOR_SHADING_IAC). */
export function interiorAttenuation(kind: keyof typeof INTERIOR_SHADING_IAC, shgc: number): number {
  const c = INTERIOR_SHADING_IAC[kind].value;
  return c.c1 - c.c2 * shgc;
}
export type InteriorShadingKey = keyof typeof INTERIOR_SHADING_IAC;

/**
 * Temperature of spaces next to the room, a Gaugeline simplification [TRADE]:
 * attic/roof cooling temperature = outdoor + adder (sun-heated attic or roof deck);
 * buffer spaces (crawl, garage, basement) sit at indoor + fraction × (outdoor − indoor).
 */
export const ADJACENT_SPACE = {
  atticCoolingAdderF: {
    value: 30,
    label: 'Attic above outdoor, summer',
    source: '[TRADE: sun-heated attic simplification, verify]',
  },
  roofCoolingAdderF: {
    value: 40,
    label: 'Roof deck sol-air above outdoor',
    source: '[TRADE: sol-air simplification, verify]',
  },
  crawlspaceVented: { value: { heating: 0.8, cooling: 0 }, label: 'Vented crawl space', source: '[TRADE]' },
  crawlspaceClosed: { value: { heating: 0.5, cooling: 0 }, label: 'Closed crawl space', source: '[TRADE]' },
  basement: { value: { heating: 0.3, cooling: 0 }, label: 'Unconditioned basement', source: '[TRADE]' },
  garage: { value: { heating: 0.6, cooling: 0.6 }, label: 'Garage', source: '[TRADE]' },
} as const;

/**
 * People gains per occupant: ASHRAE "seated, very light work" 70 W sensible, 45 W latent
 * (≈ 240 / 155 Btu/h). [PUB: ASHRAE Fundamentals 2009/2013 ch. 18 Table 1]
 * (Manual J's 230 / 200 Btu/h [MEM] is the common residential alternative.)
 */
export const PERSON_SENSIBLE_W = 70;
export const PERSON_LATENT_W = 45;
export const PEOPLE_SOURCE =
  '[PUB: ASHRAE Fundamentals ch. 18 Table 1, seated very light work, 70 W sensible / 45 W latent]';
