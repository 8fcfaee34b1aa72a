import { PEOPLE_SOURCE } from '../construction-defaults';
import { DAILY_RANGE_SOURCE } from '../solar/design-day';
import { SOLAR_STORAGE_SOURCE } from './hourly-method';

/** Plain-word statement of the load method, attached to every room and home result. */
export const METHOD_NOTES: readonly string[] = [
  'Estimate only: an hour-by-hour design-day method after ASHRAE Handbook—Fundamentals, not a full code load calculation.',
  'Cooling is worked out for every hour of the design day (the 21st of the design month, solar time). Each room shows its own peak hour; the whole-home figure is the block load — the hour at which all rooms together peak.',
  `Outdoor temperature each hour: design dry bulb − fraction × daily range ${DAILY_RANGE_SOURCE}.`,
  'Sun position and clear-sky sun: ASHRAE Handbook—Fundamentals 2013 ch. 14 equations and its 2013 clear-sky model with the site’s optical depths τb and τd (or a generic default, labelled as such).',
  `Sun through glass: area × SHGC × interior shading × (beam on the glass, less an overhang’s shadow, + sky and ground diffuse); the angle of incidence lowers the SHGC as for double clear glass [MEM: ASHRAE ch. 15 angular SHGC; its shape checked against two-pane Fresnel optics, its digits from memory]; part of it is stored by the room and reaches the load in later hours ${SOLAR_STORAGE_SOURCE}.`,
  'Walls, doors and roofs: U × area × sol-air temperature difference (absorptance from the colour), with a time lag and damping for the construction’s mass [PUB: ASHRAE ch. 18 sol-air; MEM: decrement-factor method]. Attic air from the roof’s sol-air temperature: 0.45 of the way from outdoor air, one hour behind [OWN, checked against attics measured in Florida: FSEC-CR-1220-00], 0.30 with a radiant barrier [from memory, no published source found]; a garage 0.6 of the way from indoor to outdoor [TRADE].',
  'Window conduction: U × area × (outdoor that hour − indoor).',
  'Slab floors lose heat at the exposed edge: F-factor × exposed perimeter × temperature difference [MEM: ASHRAE 90.1/IECC F-factors].',
  'Air leakage: winter air changes from the tightness (or a blower-door CFM50 ÷ 20 [TRADE]), summer half of it [TRADE/MEM]; the house’s leakage is shared among rooms by outside envelope area, so interior rooms get none. Sensible 1.08 × CFM × ΔT, latent 0.68 × CFM × Δgrains, both × altitude factor.',
  'Ventilation: the ASHRAE 62.2 rate 0.03 cfm/ft² + 7.5 cfm × (bedrooms + 1) unless entered; balanced in full, ERV/HRV after recovery, exhaust or supply only the part above leakage [MEM: ASHRAE ch. 16]; shared to rooms by floor area.',
  `People: ${PEOPLE_SOURCE}. When no room has people or appliances entered, the whole-home default 464 + 0.7 × ft² + 75 × occupants sensible and 68 + 0.07 × ft² + 41 × occupants latent is used, occupants = bedrooms + 1 [MEM: ASHRAE ch. 17 RLF]; its fixed part goes to the kitchen, the rest by floor area.`,
  'Ducts (a ducted system outside the conditioned space): the extra output needed to deliver the rooms’ load through ducts that gain or lose heat along their surface (area, insulation R) and leak air to or from the space they run in, by the ASHRAE Standard 152 design delivery-effectiveness balance; attic air of the hour in cooling, outdoor air in heating; crawl space, garage and basement as buffer spaces [TRADE]. Shared to the rooms the system serves by their load. Unless entered: duct surface 27 % (supply) and 5 % (return) of the floor served, surface film R-0.68 [MEM: Standard 152 defaults and the clause, not re-checked]; leakage 4 / 10 / 20 % each side for sealed / typical / leaky [TRADE]; blower 400 cfm per ton [TRADE].',
  'Basements: walls below grade and basement floors lose heat to the ground by the ASHRAE Handbook—Fundamentals below-grade method (average U over the depth along circular heat-flow paths through soil of conductivity 0.8 Btu/h·ft·°F) at indoor − design ground surface temperature (annual mean less the ground amplitude; the outdoor heating design temperature when none is entered, which overstates the loss) [MEM]; no summer gain below grade.',
  'Heating: conduction, slab edge, winter leakage and ventilation at the heating design temperature; no credit for sun, people or appliances.',
  'Humidity ratios: ASHRAE Handbook—Fundamentals 2017 ch. 1 psychrometric equations at the station pressure for the elevation.',
];
