import { describe, it, expect } from 'vitest';
import {
  roomInputSchema,
  designConditionsSchema,
  windowSchema,
  wallSchema,
  homeInputSchema,
  roomPlausibilityWarnings,
  designConditionsWarnings,
  roomLoad,
  CalcError,
  CALC_ERROR_MESSAGES,
  parseOrThrow,
} from '@calc';
import { conditions, livingRoom } from './sample-data';

const messages = (r: { success: boolean; error?: { issues: { message: string; path: PropertyKey[] }[] } }) =>
  r.error?.issues.map((i) => i.message) ?? [];

describe('room schema', () => {
  it('parses a walk-through room and fills defaults', () => {
    const room = roomInputSchema.parse({ id: 'r1', name: 'Den', lengthFt: 12, widthFt: 10 });
    expect(room.ceilingHeightFt).toBe(8);
    expect(room.above).toEqual({ kind: 'conditioned' });
    expect(room.exposedWalls).toEqual([]);
    expect(room.notes).toBe('');
  });
  it('bounds carry human messages for the form', () => {
    expect(messages(roomInputSchema.safeParse({ id: 'r1', name: 'Den', lengthFt: 300, widthFt: 10 }))).toContain(
      'Length must be between 1 and 200 ft',
    );
    expect(
      messages(roomInputSchema.safeParse({ id: 'r1', name: 'Den', lengthFt: 12, widthFt: 10, ceilingHeightFt: 1 })),
    ).toContain('Ceiling height must be between 2 and 40 ft');
    expect(messages(roomInputSchema.safeParse({ id: 'r1', name: '', areaFt2: 100 }))).toContain('Enter a room name');
    expect(messages(roomInputSchema.safeParse({ id: 'r1', name: 'Den' }))).toContain(
      'Enter the length and width, or the floor area',
    );
    expect(messages(wallSchema.safeParse({ direction: 'UP', lengthFt: 10 }))).toContain(
      'Choose a direction: N, NE, E, SE, S, SW, W or NW',
    );
    expect(messages(windowSchema.safeParse({ widthIn: 30 }))).toContain(
      'Enter the window width and height, or its area',
    );
    expect(messages(windowSchema.safeParse({ areaFt2: 10, shgc: 2 }))).toContain(
      'Window SHGC must be between 0.05 and 0.9',
    );
    expect(messages(roomInputSchema.safeParse({ id: 'r1', name: 'Den', lengthFt: '12', widthFt: 10 }))).toContain(
      'Length: enter a number',
    );
  });
  it('windows larger than their wall are a hard error with a path to the window field', () => {
    const r = roomInputSchema.safeParse({
      id: 'r1',
      name: 'Den',
      lengthFt: 12,
      widthFt: 10,
      exposedWalls: [{ direction: 'S', lengthFt: 10, windows: [{ areaFt2: 30 }, { areaFt2: 60 }] }],
    });
    expect(r.success).toBe(false);
    const issue = r.error?.issues.find((i) => i.message.includes('larger than the wall'));
    expect(issue?.path).toEqual(['exposedWalls', 0, 'windows', 1, 'areaFt2']);
    expect(issue?.message).toBe('The windows (90 ft²) are larger than the wall (80 ft²)');
  });
  it('one window larger than its wall is named on the width and height typed, with both sizes', () => {
    // 120 in × 72 in = 60 ft² (1 ft² = 144 in²); wall 6 ft × 8 ft default ceiling = 48 ft²
    const r = roomInputSchema.safeParse({
      id: 'r1',
      name: 'Den',
      lengthFt: 12,
      widthFt: 10,
      exposedWalls: [{ direction: 'S', lengthFt: 6, windows: [{ widthIn: 120, heightIn: 72 }] }],
    });
    const issues = (r.error?.issues ?? []).map((i) => [i.path.join('.'), i.message]);
    expect(issues).toEqual([
      ['exposedWalls.0.windows.0.widthIn', 'The window (60 ft²) is larger than its wall (48 ft²)'],
      ['exposedWalls.0.windows.0.heightIn', 'The window (60 ft²) is larger than its wall (48 ft²)'],
    ]);
  });
  it('a refused wall length is the only message: the windows are not compared with a 0 ft wall', () => {
    const r = roomInputSchema.safeParse({
      id: 'r1',
      name: 'Den',
      lengthFt: 12,
      widthFt: 10,
      exposedWalls: [{ direction: 'S', lengthFt: 0, windows: [{ widthIn: 36, heightIn: 48 }] }],
    });
    expect((r.error?.issues ?? []).map((i) => i.path.join('.'))).toEqual(['exposedWalls.0.lengthFt']);
  });
  it('home rooms need unique ids', () => {
    const r = homeInputSchema.safeParse({ designConditions: conditions, rooms: [livingRoom, livingRoom] });
    expect(messages(r)).toContain('Each room needs its own id');
  });
});

describe('design conditions schema', () => {
  it('needs a wet bulb or grains; wet bulb ≤ dry bulb; winter below indoor', () => {
    expect(
      messages(designConditionsSchema.safeParse({ outdoorCoolingDryBulbF: 95, outdoorHeatingDryBulbF: 10 })),
    ).toContain('Enter the coincident wet bulb or the outdoor humidity in grains');
    expect(
      messages(
        designConditionsSchema.safeParse({
          outdoorCoolingDryBulbF: 80,
          outdoorCoolingWetBulbF: 85,
          outdoorHeatingDryBulbF: 10,
        }),
      ),
    ).toContain('Wet bulb cannot be above the dry bulb');
    expect(
      messages(
        designConditionsSchema.safeParse({
          outdoorCoolingDryBulbF: 95,
          outdoorCoolingGrains: 100,
          outdoorHeatingDryBulbF: 75,
        }),
      ),
    ).toContain('Outdoor heating design temperature must be below the indoor heating set point');
    expect(designConditionsSchema.parse(conditions).elevationFt).toBe(0);
  });
  it('warns (softly) past the IECC 72 °F / 75 °F interior design limits', () => {
    // [PUB (secondary): IECC R302.1 72 °F heating / 75 °F cooling]
    const c = designConditionsSchema.parse({ ...conditions, indoorHeatingF: 74, indoorCoolingF: 72 });
    expect(designConditionsWarnings(c).map((w) => w.path[0])).toEqual(['indoorHeatingF', 'indoorCoolingF']);
  });
});

describe('plausibility warnings (soft) and calc errors (hard)', () => {
  it('a 2 ft ceiling passes the schema but warns in plain words', () => {
    const room = roomInputSchema.parse({ id: 'r', name: 'Loft', lengthFt: 10, widthFt: 10, ceilingHeightFt: 2 });
    const w = roomPlausibilityWarnings(room);
    expect(w[0]).toEqual({
      path: ['ceilingHeightFt'],
      message: 'A 2 ft ceiling is unusually low — check the measurement.',
    });
  });
  it('mostly-glass walls and crowded rooms warn', () => {
    const room = roomInputSchema.parse({
      id: 'r',
      name: 'Sunroom',
      lengthFt: 10,
      widthFt: 10,
      occupants: 8,
      exposedWalls: [{ direction: 'S', lengthFt: 10, windows: [{ areaFt2: 60 }] }],
    });
    const paths = roomPlausibilityWarnings(room).map((w) => w.path.join('.'));
    expect(paths).toContain('exposedWalls.0.windows');
    expect(paths).toContain('occupants');
  });
  it('roomLoad throws CalcError INVALID_INPUT with field details', () => {
    try {
      roomLoad({ room: { ...livingRoom, lengthFt: -3 }, designConditions: conditions });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(CalcError);
      if (!(e instanceof CalcError)) return;
      expect(e.code).toBe('INVALID_INPUT');
      expect(e.message).toBe(CALC_ERROR_MESSAGES.INVALID_INPUT);
      expect(e.details).toContainEqual({ path: ['lengthFt'], message: 'Length must be between 1 and 200 ft' });
    }
  });
  it('parseOrThrow returns typed output on success', () => {
    expect(parseOrThrow(windowSchema, { areaFt2: 12 }).count).toBe(1);
  });
});
