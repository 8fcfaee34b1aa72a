import { PEOPLE_SOURCE, SHADE_IAC_NOTE } from '../construction-defaults';
import { DAILY_RANGE_SOURCE } from '../solar/design-day';
import { RTS_SOURCE } from './hourly-method';

/** Plain-word statement of the load method, attached to every room and home result. */
export const METHOD_NOTES: readonly string[] = [
  'Estimate only: an hour-by-hour design-day method after ASHRAE Handbook—Fundamentals, not a full code load calculation.',
  'Cooling is worked out for every hour of the design day (the 21st of the design month, solar time). Each room shows its own peak hour; the whole-home figure is the block load — the hour at which all rooms together peak.',
  `Outdoor temperature each hour: design dry bulb − fraction × daily range ${DAILY_RANGE_SOURCE}.`,
  'Sun position and clear-sky sun: ASHRAE Handbook—Fundamentals 2013 ch. 14 equations and its 2013 clear-sky model with the site’s optical depths τb and τd (or a generic default, labelled as such).',
  `Sun through glass: area × SHGC × interior shading IAC × (beam on the glass, less an overhang’s shadow, + sky and ground diffuse); the angle of incidence lowers the SHGC as it lowers the solar transmittance of two clear panes — Fresnel reflection at each surface and absorption along the slanted path [PUB: Duffie and Beckman, Solar Engineering of Thermal Processes, ch. 5; glass refractive index 1.525 from Rubin, Solar Energy Materials 12 (1985)]. ${SHADE_IAC_NOTE}`,
  `Heat storage in the room: every heat gain becomes cooling load by the radiant time series of ASHRAE Handbook—Fundamentals ch. 18, for the house’s construction class (light, medium or heavy; medium unless the walk-through chooses another), with carpet and glass a tenth of the outside wall — its convective part at once, its radiant part spread over the next hours of the repeating design day. Sun through glass with no interior shade is all radiant, the beam through the solar factors and the diffuse through the nonsolar ones; behind an interior shade, beam and diffuse go through the nonsolar factors with the radiant part the handbook gives that kind of shade beside its interior attenuation (ch. 15) — roller shades 0.44 [PUB: the dark opaque roller shade on double clear glass], blinds 0.71 [PUB: the published louvered-shade row with open slats, the nearest found to half-open blinds], drapes 0.63 [MEM: no published drapery figure found; 0.63 is an older edition’s single figure]; walls and floors 0.46, roofs and ceilings 0.60, windows 0.33 (SHGC over 0.5) or 0.46; air leakage and ventilation none ${RTS_SOURCE}.`,
  'Walls, doors and roofs: U × area × sol-air temperature difference (absorptance from the colour), with a time lag and damping for the construction’s mass [PUB: ASHRAE ch. 18 sol-air; lag and damping from the periodic conduction through representative walls with the material properties ORNL published; the walls’ make-up is an assumption, see below]. Attic air from the roof’s sol-air temperature: 0.45 of the way from outdoor air, one hour behind [OWN, checked against attics measured in Florida: FSEC-CR-1220-00], 0.38 with a radiant barrier [PUB: the ratio of two side-by-side vented attics’ peak excess over outdoor air measured with and without a barrier, 36.1 and 42.9 °F: Parker and Sherwin, Comparative Summer Attic Thermal Performance of Six Roof Constructions, Florida Solar Energy Center 1998]; a garage 0.6 of the way from indoor to outdoor [TRADE].',
  'Window conduction: U × area × (outdoor that hour − indoor).',
  'Slab floors lose heat at the exposed edge: F-factor × exposed perimeter × temperature difference [MEM: ASHRAE 90.1/IECC F-factors].',
  'Air leakage, both seasons from one effective leakage area A_L: the tightness’s unit leakage area × the exposed walls and ceilings, or a blower-door CFM50 taken to 4 Pa with pressure exponent 0.65 [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 17 eq. (9) and Table 3; ch. 16 eqs. (40)–(41)]; design leakage A_L × IDF, IDF = (I0 + I1 × stack height × |indoor − outdoor|)/1000, with the chapter’s coefficients for its cooling wind 3.4 m/s and heating wind 6.7 m/s, typical suburban shelter, no flue (a flue would raise I0 by I2 × its share of A_L, I2 0.12 cooling and 0.23 heating) [PUB: ch. 17 eq. (10), its fit to the ch. 16 stack-and-wind model]. The house’s leakage is shared among rooms by outside envelope area, so interior rooms get none [OWN: stated rule]. Sensible 1.08 × CFM × ΔT, latent 0.68 × CFM × Δgrains, both × altitude factor.',
  'Ventilation: the ASHRAE 62.2 rate 0.03 cfm/ft² + 7.5 cfm × (bedrooms + 1) unless entered; balanced in full, ERV/HRV after recovery, exhaust or supply only the part above leakage [MEM: ASHRAE ch. 16]; shared to rooms by floor area.',
  `People: ${PEOPLE_SOURCE}. When no room has people or appliances entered, the whole-home default 464 + 0.7 × ft² + 75 × occupants sensible and 68 + 0.07 × ft² + 41 × occupants latent is used, occupants = bedrooms + 1 [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 17 eqs. (30)–(31)]; its fixed part goes to the kitchen, the rest by floor area.`,
  'Ducts (a ducted system outside the conditioned space): the extra output needed to deliver the rooms’ load through ducts that gain or lose heat along their surface (area, insulation R) and leak air to or from the space they run in, by a design delivery-effectiveness energy balance after ASHRAE Standard 152 (re-derived, no clause cited); attic air of the hour in cooling, outdoor air in heating; crawl space, garage and basement as buffer spaces [TRADE]. Shared to the rooms the system serves by their load. Unless entered: duct surface outside the conditioned space 27 % (supply) and 5 % per return register (one per storey) of the floor served, × 0.75 in a house of two or more storeys [PUB: ASHRAE Standard 152-2004 defaults, as NREL’s OpenStudio-HPXML documentation gives them]; surface film R-0.68, still air on a vertical surface [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 26 Table 10] (measured flex duct runs below nominal R + film, so duct conduction is on the low side); leakage 4 / 10 / 20 % each side for sealed / typical / leaky [TRADE]; blower 400 cfm per ton [TRADE].',
  'Basements: walls below grade and basement floors lose heat to the ground by the ASHRAE Handbook—Fundamentals below-grade method (average U over the depth along circular heat-flow paths through soil of conductivity 0.8 Btu/h·ft·°F) at indoor − design ground surface temperature (annual mean less the ground amplitude; the outdoor heating design temperature when none is entered, which overstates the loss) [MEM; the basement-floor form is an assumption, see below]; no summer gain below grade.',
  'Heating: conduction, slab edge, winter leakage and ventilation at the heating design temperature; no credit for sun, people or appliances.',
  'Humidity ratios: ASHRAE Handbook—Fundamentals 2017 ch. 1 psychrometric equations at the station pressure for the elevation.',
];

/** A constant of the method for which no citable public source was found (issue 9), and what it does to the review ranch. */
export interface MethodAssumption {
  readonly key: 'flue' | 'wall-mass' | 'glass-absorption' | 'basement-floor';
  /** The constant and the value used. */
  readonly what: string;
  /** The plausible low and high values tried, as a phrase ("at 0.3 to 0.7"). */
  readonly range: string;
  /**
   * The review ranch's cooling block (tests/calc/ranch-home.ts: 1,800 ft², 95/75 °F, 36° N), Btu/h, as used
   * and with the constant at its low and high values; `variant` names a change to the ranch where the
   * ranch itself does not use the constant. Null where the ranch has nothing the constant touches.
   * tests/calc/method-constants.test.ts recomputes every figure.
   */
  readonly ranch: {
    readonly variant?: string;
    readonly asUsed: number;
    readonly low: number;
    readonly high: number;
  } | null;
  /** Where there is no ranch figure, or a bound instead of one: what is said. */
  readonly effect?: string;
  /** The method has the term but the walk-through does not record its input (so it is assumed absent). */
  readonly notEntered?: true;
}

/** Ordered by how much they move the review ranch's cooling block. */
export const METHOD_ASSUMPTIONS: readonly MethodAssumption[] = [
  {
    key: 'wall-mass',
    what: 'the make-up of the two representative walls whose periodic conduction gives the time lag and damping (frame: stucco, R-13, gypsum → 1 h and 0.98; masonry: 8 in concrete, gypsum → 6 h and 0.50)',
    range: 'at no lag or damping to the older recalled 2 h and 0.9 for frame',
    ranch: { asUsed: 25286, low: 25248, high: 25011 },
  },
  {
    key: 'flue',
    what: 'no open flue (furnace, water heater or fireplace): the leakage is that of a house without one',
    range: 'with a flue of half the house’s leakage area (the most the leakage equation allows)',
    notEntered: true,
    ranch: { asUsed: 25286, low: 25286, high: 25405 },
  },
  {
    key: 'glass-absorption',
    what: 'glass absorption K·L 0.03 per clear pane in the angle-of-incidence optics',
    range: 'at 0 to 0.06',
    ranch: null,
    effect:
      'the angular ratio moves by at most 2 % at any angle, so the example ranch’s block moves by at most about 225 Btu/h (2 % of its 11,224 Btu/h of sun through glass)',
  },
  {
    key: 'basement-floor',
    what: 'the basement-floor heat-loss formula (heat paths from the floor along half circles to the ground outside)',
    range: '—',
    ranch: null,
    effect: 'no effect on the example ranch (slab on grade); it sets the heat loss of basement floors only',
  },
];

const btuh = (n: number): string => String(Math.round(n)).replace(/\B(?=(\d{3})+(?!\d))/g, ',');

/** One assumption in plain words, as the loads page prints it. */
export function methodAssumptionText(a: MethodAssumption): string {
  const head = a.notEntered
    ? `Assumption (not recorded on the walk-through): ${a.what}.`
    : `Assumption (no published source found): ${a.what}.`;
  if (!a.ranch) return a.effect ? `${head} ${a.effect.charAt(0).toUpperCase()}${a.effect.slice(1)}.` : head;
  const r = a.ranch;
  // Smaller figure first, whichever end of the range gives it (a range read "25,248 to 25,011" trips the reader).
  const lo = Math.min(r.low, r.high);
  const hi = Math.max(r.low, r.high);
  const figures = lo === hi ? `${btuh(lo)} Btu/h` : `between ${btuh(lo)} and ${btuh(hi)} Btu/h`;
  return (
    `${head} ${a.range.charAt(0).toUpperCase()}${a.range.slice(1)}, the example ranch’s block cooling load${r.variant ? ` ${r.variant}` : ''} is ` +
    `${figures} (${btuh(r.asUsed)} as used).`
  );
}
