import type { RoomInputValue } from '../sync/edits';

/**
 * Starting points for a typical room, so most rooms take a few taps. Values are ordinary
 * assumptions for a single-family home and are all editable; ids are given when a room is made.
 */
export interface RoomTemplate {
  readonly key: string;
  readonly label: string;
  readonly input: RoomInputValue;
}

const wall = (direction: string, lengthFt: number, windows: number) => ({
  direction,
  lengthFt,
  construction: 'wood-2x4-r13',
  windows: Array.from({ length: windows > 0 ? 1 : 0 }, () => ({
    widthIn: 36,
    heightIn: 48,
    count: windows,
    glazing: 'double-clear',
    interiorShading: 'blinds',
  })),
  doors: [],
});

export const ROOM_TEMPLATES: readonly RoomTemplate[] = [
  {
    key: 'bedroom',
    label: 'Bedroom',
    input: {
      name: 'Bedroom',
      floorLevel: 1,
      lengthFt: 12,
      widthFt: 11,
      ceilingHeightFt: 8,
      exposedWalls: [wall('N', 12, 1)],
      above: { kind: 'attic', insulation: 'r30' },
      below: { kind: 'slab', edgeInsulated: false },
      occupants: 2,
      appliances: [],
      notes: '',
    },
  },
  {
    key: 'living',
    label: 'Living room',
    input: {
      name: 'Living room',
      floorLevel: 1,
      lengthFt: 18,
      widthFt: 14,
      ceilingHeightFt: 8,
      exposedWalls: [wall('S', 18, 2), wall('W', 14, 1)],
      above: { kind: 'attic', insulation: 'r30' },
      below: { kind: 'slab', edgeInsulated: false },
      occupants: 4,
      appliances: [{ label: 'TV', gain: 150, unit: 'W', latentBtuh: 0 }],
      notes: '',
    },
  },
  {
    key: 'kitchen',
    label: 'Kitchen',
    input: {
      name: 'Kitchen',
      floorLevel: 1,
      lengthFt: 14,
      widthFt: 12,
      ceilingHeightFt: 8,
      exposedWalls: [wall('E', 14, 1)],
      above: { kind: 'attic', insulation: 'r30' },
      below: { kind: 'slab', edgeInsulated: false },
      occupants: 2,
      appliances: [
        { label: 'Refrigerator', gain: 300, unit: 'W', latentBtuh: 0 },
        { label: 'Range (average use)', gain: 1200, unit: 'W', latentBtuh: 400 },
      ],
      notes: '',
    },
  },
  {
    key: 'bathroom',
    label: 'Bathroom',
    input: {
      name: 'Bathroom',
      floorLevel: 1,
      lengthFt: 8,
      widthFt: 6,
      ceilingHeightFt: 8,
      exposedWalls: [wall('N', 8, 0)],
      above: { kind: 'attic', insulation: 'r30' },
      below: { kind: 'slab', edgeInsulated: false },
      occupants: 0,
      appliances: [],
      notes: '',
    },
  },
  {
    key: 'blank',
    label: 'Blank room',
    input: {
      name: 'Room',
      floorLevel: 1,
      lengthFt: 12,
      widthFt: 12,
      ceilingHeightFt: 8,
      exposedWalls: [],
      above: { kind: 'conditioned' },
      below: { kind: 'conditioned' },
      occupants: 0,
      appliances: [],
      notes: '',
    },
  },
];

export function newRoomId(): string {
  return crypto.randomUUID();
}

/** A copy of a room for the next one: same shape, new id, "(copy)" name. */
export function copyRoomInput(input: RoomInputValue, id: string): RoomInputValue {
  const name = typeof input.name === 'string' ? input.name : 'Room';
  const copied: RoomInputValue = structuredClone(input);
  return { ...copied, id, name: `${name} (copy)`.slice(0, 80) };
}

/** A fresh exposed wall for "Add wall". */
export const NEW_WALL = { direction: 'N', lengthFt: 12, construction: 'wood-2x4-r13', windows: [], doors: [] };
