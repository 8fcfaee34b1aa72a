import type { HomeInput, RoomInput } from '@calc';

/**
 * The invented 1,800 ft² slab ranch of the load review (issue 9): 60 × 30 ft, front to the
 * south, 8 ft ceilings, slab on grade, R-30 attic, 2×4 R-13 walls, average tightness,
 * double clear glass (≈ 14 % of floor area, no interior shading, no overhangs), 95/75 °F
 * summer, 10/70 °F winter, 3 bedrooms, no people or appliances entered. Invented data only.
 */
const room = (
  id: string,
  name: string,
  lengthFt: number,
  widthFt: number,
  walls: { direction: 'N' | 'E' | 'S' | 'W'; lengthFt: number; glassFt2: number; doorFt2?: number }[],
): RoomInput => ({
  id,
  name,
  lengthFt,
  widthFt,
  ceilingHeightFt: 8,
  exposedWalls: walls.map((w) => ({
    direction: w.direction,
    lengthFt: w.lengthFt,
    construction: 'wood-2x4-r13',
    windows: w.glassFt2 > 0 ? [{ areaFt2: w.glassFt2, glazing: 'double-clear' }] : [],
    doors: w.doorFt2 ? [{ areaFt2: w.doorFt2, doorType: 'insulated-steel' }] : [],
  })),
  above: { kind: 'attic', insulation: 'r30' },
  below: { kind: 'slab', edgeInsulated: false },
});

export const ranchRooms: RoomInput[] = [
  room('living', 'Living room', 20, 16, [
    { direction: 'S', lengthFt: 20, glassFt2: 60 },
    { direction: 'W', lengthFt: 16, glassFt2: 20 },
  ]),
  room('kitchen', 'Kitchen and dining', 20, 14, [
    { direction: 'N', lengthFt: 20, glassFt2: 20 },
    { direction: 'W', lengthFt: 14, glassFt2: 30 },
  ]),
  room('entry', 'Entry', 20, 8, [{ direction: 'S', lengthFt: 20, glassFt2: 10, doorFt2: 20 }]),
  room('hall', 'Hall', 20, 6, []),
  room('bath', 'Bath', 10, 16, [{ direction: 'N', lengthFt: 10, glassFt2: 5 }]),
  room('bed3', 'Bedroom 3', 10, 16, [{ direction: 'N', lengthFt: 10, glassFt2: 15 }]),
  room('bed1', 'Main bedroom', 20, 16, [
    { direction: 'S', lengthFt: 20, glassFt2: 30 },
    { direction: 'E', lengthFt: 16, glassFt2: 24 },
  ]),
  room('bed2', 'Bedroom 2', 20, 14, [
    { direction: 'N', lengthFt: 20, glassFt2: 15 },
    { direction: 'E', lengthFt: 14, glassFt2: 20 },
  ]),
];

export const ranchHome: HomeInput = {
  name: 'Review ranch',
  designConditions: {
    outdoorCoolingDryBulbF: 95,
    outdoorCoolingWetBulbF: 75,
    outdoorHeatingDryBulbF: 10,
    indoorCoolingF: 75,
    indoorHeatingF: 70,
    indoorCoolingRhPercent: 50,
    dailyRangeF: 20,
    elevationFt: 0,
    latitudeDeg: 36,
    designMonth: 7,
  },
  tightness: 'average',
  bedrooms: 3,
  rooms: ranchRooms,
};
