import { IRRADIANCE_SOURCE, PEOPLE_SOURCE } from '../construction-defaults';

/** Plain-word statement of the load method, attached to every room and home result. */
export const METHOD_NOTES: readonly string[] = [
  'Estimate only: a simplified room-by-room method, not a full code load calculation.',
  'Walls, doors, ceilings, framed floors and window conduction: U × area × temperature difference [PUB: U-factor definition].',
  'Window cooling temperature difference is reduced by 0.46 × daily range [MEM: ASHRAE Fundamentals ch. 17 RLF].',
  `Sun through glass: area × SHGC × peak irradiance for the facing × interior shading factor; the irradiance figures are a documented simplification ${IRRADIANCE_SOURCE}.`,
  'Attic and roof ceilings are taken hotter than outdoors in summer (+30 °F attic, +40 °F roof); crawl spaces, basements and garages sit part-way between indoor and outdoor [TRADE simplification].',
  'Slab floors lose heat at the exposed edge: F-factor × exposed perimeter × temperature difference [MEM: ASHRAE 90.1/IECC F-factors].',
  'Air leakage: air changes per hour × volume ÷ 60; sensible 1.08 × CFM × ΔT, latent 0.68 × CFM × Δgrains, both × altitude factor [PUB: §1 constants].',
  `People: ${PEOPLE_SOURCE}; counted for cooling only.`,
  'Appliances and lights: watts × 3.412 Btu/h per W; counted for cooling only, no heating credit.',
  'Humidity ratios: ASHRAE Handbook—Fundamentals 2017 ch. 1 psychrometric equations at the station pressure for the elevation.',
];
