/** The eight compass directions a wall or window can face: one list for the schemas and the sun. */
export const FACINGS = ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'] as const;
export type Facing = (typeof FACINGS)[number];

/** The azimuth (clockwise from north) of each compass facing. */
export const FACING_AZIMUTH_DEG: Readonly<Record<Facing, number>> = {
  N: 0,
  NE: 45,
  E: 90,
  SE: 135,
  S: 180,
  SW: 225,
  W: 270,
  NW: 315,
};
