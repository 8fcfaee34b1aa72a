import { floorAreaFt2, wallAboveGradeFt2 } from '../geometry';
import { parseOrThrow } from '../parse';
import { roundHalfUp } from '../rounding';
import { designConditionsSchema, type DesignConditionsInput } from '../schemas/design-conditions';
import { roomInputSchema, type Room, type RoomInput } from '../schemas/room-input';
import { tightnessSchema, type Tightness } from '../schemas/home';
import { LATENT_CONSTANT, SENSIBLE_CONSTANT } from '../air';
import { doorAreaFt2, windowAreaFt2 } from '../geometry';
import {
  CEILING_INSULATION,
  DOOR_TYPES,
  FLOOR_INSULATION,
  GLAZING_TYPES,
  interiorAttenuation,
  WALL_CONSTRUCTIONS,
} from '../construction-defaults';
import { designPsychrometrics, type DesignPsychrometrics } from './conditions';
import { ceilingLoad, exposedWallsLoad, floorLoad } from './envelope';
import { appliancesLoad, peopleLoad } from './internal';
import { METHOD_NOTES } from './notes';
import { designDayContext, HOURS, radiantTimeSeries, type DesignDayContext } from './design-day-context';
import {
  GARAGE_COOLING_FRACTION,
  RADIANT_FRACTION,
  SHADED_SUN_RADIANT_FRACTION,
  SHADE_KINDS,
  type MassClass,
  type ShadeKind,
} from './hourly-method';
import { designLeakageCfm, leakageAreaFromTightnessCm2 } from './infiltration';
import { peakDetail, type PeakDetail } from './peak-detail';

/** Load components, Btu/h, each rounded half-up to 1 Btu/h; `total` = sum of the rounded parts. */
export interface LoadComponents {
  readonly walls: number;
  readonly windowsConduction: number;
  readonly windowsSolar: number;
  readonly doors: number;
  readonly ceiling: number;
  readonly floor: number;
  readonly infiltration: number;
  readonly ventilation: number;
  readonly people: number;
  readonly appliances: number;
  /** Duct gains or losses of a ducted system serving the room (0 when none). */
  readonly ducts: number;
  readonly total: number;
}

export type ComponentKey = Exclude<keyof LoadComponents, 'total'>;
export const COMPONENT_KEYS: readonly ComponentKey[] = [
  'walls',
  'windowsConduction',
  'windowsSolar',
  'doors',
  'ceiling',
  'floor',
  'infiltration',
  'ventilation',
  'people',
  'appliances',
  'ducts',
];
/** Columns of a room's hourly table (one per component). */
export const COMPONENT_COUNT = COMPONENT_KEYS.length;
const K = COMPONENT_COUNT;

/** One room's estimated loads. Cooling figures are the room's own peak hour of the design day. */
export interface RoomLoad {
  readonly roomId: string;
  readonly roomName: string;
  readonly floorAreaFt2: number;
  readonly volumeFt3: number;
  /** Summer (cooling) leakage, CFM. */
  readonly infiltrationCfm: number;
  /** Winter (heating) leakage, CFM. */
  readonly infiltrationHeatingCfm: number;
  /** The room's share of whole-house ventilation, CFM. */
  readonly ventilationCfm: number;
  /** Hour (1–24, solar time) of the room's sensible peak. */
  readonly peakHour: number;
  /** Sensible gain each hour 1–24 (index 0 = hour 1), Btu/h, each the sum of that hour's rounded parts. */
  readonly hourlySensibleBtuh: readonly number[];
  /** Sensible gain at the room's peak hour, by component. */
  readonly sensibleGain: LoadComponents;
  /** Latent gain (the same every hour of the design day). */
  readonly latentGain: LoadComponents;
  readonly heatLoss: LoadComponents;
  readonly coolingTotalBtuh: number;
  /** The room's part of the home's block load: its sensible gain at the home's peak hour. */
  readonly atBlock: { readonly hour: number; readonly sensibleBtuh: number; readonly latentBtuh: number };
  /** The drill-down at the room's peak hour: walls and windows by façade (they add up to the components). */
  readonly atPeak: PeakDetail;
  readonly notes: readonly string[];
  readonly isEstimate: true;
}

type Parts = Record<ComponentKey, number>;

/** Rounds each part half-up to 1 Btu/h and adds a total equal to their sum. */
export function toComponents(parts: Parts): LoadComponents {
  const walls = roundHalfUp(parts.walls);
  const windowsConduction = roundHalfUp(parts.windowsConduction);
  const windowsSolar = roundHalfUp(parts.windowsSolar);
  const doors = roundHalfUp(parts.doors);
  const ceiling = roundHalfUp(parts.ceiling);
  const floor = roundHalfUp(parts.floor);
  const infiltration = roundHalfUp(parts.infiltration);
  const ventilation = roundHalfUp(parts.ventilation);
  const people = roundHalfUp(parts.people);
  const appliances = roundHalfUp(parts.appliances);
  const ducts = roundHalfUp(parts.ducts);
  const total =
    walls +
    windowsConduction +
    windowsSolar +
    doors +
    ceiling +
    floor +
    infiltration +
    ventilation +
    people +
    appliances +
    ducts;
  return {
    walls,
    windowsConduction,
    windowsSolar,
    doors,
    ceiling,
    floor,
    infiltration,
    ventilation,
    people,
    appliances,
    ducts,
    total,
  };
}

/** Components from a row of already-rounded parts (in COMPONENT_KEYS order). */
function componentsFromRow(row: ArrayLike<number>, offset: number): LoadComponents {
  const v = (i: number) => row[offset + i] ?? 0;
  const total = v(0) + v(1) + v(2) + v(3) + v(4) + v(5) + v(6) + v(7) + v(8) + v(9) + v(10);
  return {
    walls: v(0),
    windowsConduction: v(1),
    windowsSolar: v(2),
    doors: v(3),
    ceiling: v(4),
    floor: v(5),
    infiltration: v(6),
    ventilation: v(7),
    people: v(8),
    appliances: v(9),
    ducts: v(10),
    total,
  };
}

/** What the home gives a room: its air (leakage and ventilation shares) and any default internal gains. */
export interface RoomAir {
  readonly summerCfm: number;
  readonly winterCfm: number;
  /** Ventilation CFM that loads the room: sensible in cooling, latent, and in heating (after any recovery). */
  readonly ventCfm: number;
  readonly ventCoolingSensibleCfm: number;
  readonly ventLatentCfm: number;
  readonly ventHeatingCfm: number;
  /** Default internal gains given to this room (when the home has none entered), Btu/h. */
  readonly defaultInternal?: {
    readonly peopleSensible: number;
    readonly peopleLatent: number;
    readonly otherSensible: number;
    readonly otherLatent: number;
  };
}

/**
 * Exposed surface through which a room leaks, ft²: exposed walls above grade (gross, windows and doors included),
 * a ceiling under an attic or roof, and a floor over a vented crawl space or a garage; not a slab, a basement
 * floor or a floor over a sealed crawl space or basement (whose above-grade walls the walk-through does not record).
 * [PUB: ASHRAE Handbook—Fundamentals 2021 ch. 17 Table 4 "Evaluation of Exposed Surface Area"; the floor over a
 * garage is counted as the table counts a wall shared with one]
 */
export function exposedEnvelopeFt2(room: Room): number {
  let a = 0;
  for (const w of room.exposedWalls) a += wallAboveGradeFt2(w, room.ceilingHeightFt);
  if (room.above.kind !== 'conditioned') a += floorAreaFt2(room);
  const below = room.below;
  if (below.kind === 'garage' || (below.kind === 'crawlspace' && below.vented)) a += floorAreaFt2(room);
  return a;
}

const pos = (x: number): number => (x > 0 ? x : 0);
/** `roundHalfUp(x)` for a finite x ≥ 0 (the hourly parts), without the argument checks on the hot path. */
const r0 = (x: number): number => Math.floor(x + 0.5 + x * 1e-12);
const addInto = (to: Float64Array, from: Float64Array): void => {
  for (let h = 0; h < HOURS; h += 1) to[h] = (to[h] ?? 0) + (from[h] ?? 0);
};
const massOf = (construction: string): MassClass => (construction.startsWith('masonry') ? 'masonry' : 'frame');

/** The room's hourly parts, rounded, in a 24 × K table (row h = hour h + 1). */
export interface RoomHourly {
  readonly room: Room;
  readonly air: RoomAir;
  readonly ctx: DesignDayContext;
  /** Hourly rounded parts; column `ducts` is filled by the home when a ducted system serves the room. */
  readonly table: Float64Array;
  readonly hourly: Float64Array;
  readonly peakIndex: number;
  readonly latent: LoadComponents;
  /** The room's share of the ducted system's heating loss, Btu/h (rounded). */
  readonly ductHeatingBtuh: number;
}

/**
 * One room hour by hour (cooling). Each part's heat gain each hour becomes cooling load by the radiant time
 * series (ASHRAE ch. 18; hourly-method.ts): its convective part at once, its radiant part spread over the
 * following hours of the periodic design day. Each part, each hour, ≥ 0 and rounded half-up:
 * - opaque walls and doors: U·A × the sol-air equivalent ΔT of their facing, colour and mass (radiant 0.46);
 * - window conduction: U·A × (outdoor(h) − indoor) (radiant 0.33 for SHGC over 0.5, else 0.46);
 * - sun through glass: A·SHGC·IAC × (beam × angular SHGC ratio × sunlit fraction under the overhang, wholly
 *   radiant through the solar factors, + diffuse × hemispherical ratio, wholly radiant through the nonsolar
 *   ones); behind an interior shade both radiant by the shade's FR (SHADED_SUN_RADIANT_FRACTION: shades 0.44,
 *   blinds and drapes 0.63 from memory) through the nonsolar factors;
 * - ceiling: U·A × (attic air − indoor) or the roof's equivalent ΔT (radiant 0.60); floor over a garage:
 *   U·A × 0.6 × ΔT(h) (radiant 0.46);
 * - leakage and ventilation: 1.08 × CFM × ΔT(h) × altitude factor (convective); people and appliances
 *   constant (a steady gain is its own cooling load).
 */
export function roomHourly(room: Room, p: DesignPsychrometrics, ctx: DesignDayContext, air: RoomAir): RoomHourly {
  const table = new Float64Array(HOURS * K);
  const hourly = new Float64Array(HOURS);
  const dt = ctx.outdoorDtF;
  let glassUAOver = 0;
  let glassUAUnder = 0;
  // Beam gains of glass under an overhang (the shadow moves with the sun), before the radiant time series.
  let beamOpen: Float64Array | null = null;
  const beamShaded: Partial<Record<ShadeKind, Float64Array>> = {};
  const solar = new Float64Array(HOURS);
  // walls and doors accumulate per hour directly
  const walls = new Float64Array(HOURS);
  const doors = new Float64Array(HOURS);
  for (const wall of room.exposedWalls) {
    const fs = ctx.facing[wall.direction];
    const color = wall.color ?? 'medium';
    let openings = 0;
    for (const w of wall.windows) {
      const g = GLAZING_TYPES[w.glazing].value;
      const u = w.uFactor ?? g.u;
      const shgc = w.shgc ?? g.shgc;
      const a = windowAreaFt2(w);
      openings += a;
      if (shgc > 0.5) glassUAOver += u * a;
      else glassUAUnder += u * a;
      const iac = interiorAttenuation(w.interiorShading, shgc);
      const shade = w.interiorShading === 'none' ? null : w.interiorShading;
      const k = a * shgc * iac;
      const depth = w.overhangDepthFt ?? 0;
      if (depth > 0) {
        // Shadow of a long horizontal overhang: it falls depth × tan(profile angle) below the overhang;
        // the window's top sits `gap` below it. [PUB: ASHRAE Fundamentals ch. 15 exterior shading, profile angle]
        const heightFt = w.heightIn !== undefined ? w.heightIn / 12 : Math.sqrt(a / w.count);
        const gap = w.overhangGapFt ?? 0;
        const beam = shade ? (beamShaded[shade] ??= new Float64Array(HOURS)) : (beamOpen ??= new Float64Array(HOURS));
        const diffuse = shade ? fs.shaded[shade].diffuseLoad : fs.diffuseLoad;
        for (let h = 0; h < HOURS; h += 1) {
          const cut = Math.min(heightFt, pos(depth * (fs.profileTan[h] ?? 0) - gap));
          const sunlit = heightFt > 0 ? 1 - cut / heightFt : 1;
          beam[h] = (beam[h] ?? 0) + k * (fs.glassBeam[h] ?? 0) * sunlit;
          solar[h] = (solar[h] ?? 0) + k * (diffuse[h] ?? 0);
        }
      } else {
        const load = shade ? fs.shaded[shade].solarLoad : fs.solarLoad;
        for (let h = 0; h < HOURS; h += 1) solar[h] = (solar[h] ?? 0) + k * (load[h] ?? 0);
      }
    }
    for (const d of wall.doors) {
      const a = doorAreaFt2(d);
      openings += a;
      const ua = (d.uFactor ?? DOOR_TYPES[d.doorType].value) * a;
      const edt = ctx.wallLoadDt(wall.direction, color, 'frame');
      for (let h = 0; h < HOURS; h += 1) doors[h] = (doors[h] ?? 0) + ua * (edt[h] ?? 0);
    }
    const net = Math.max(0, wallAboveGradeFt2(wall, room.ceilingHeightFt) - openings);
    const ua = (wall.uFactor ?? WALL_CONSTRUCTIONS[wall.construction].value) * net;
    const edt = ctx.wallLoadDt(wall.direction, color, massOf(wall.construction));
    for (let h = 0; h < HOURS; h += 1) walls[h] = (walls[h] ?? 0) + ua * (edt[h] ?? 0);
  }
  if (beamOpen) addInto(solar, radiantTimeSeries(beamOpen, RADIANT_FRACTION.sunUnshaded, ctx.rts.solar));
  for (const kind of SHADE_KINDS) {
    const beam = beamShaded[kind];
    if (beam) addInto(solar, radiantTimeSeries(beam, SHADED_SUN_RADIANT_FRACTION[kind], ctx.rts.nonsolar));
  }
  const glassOver = ctx.windowLoadDt(true);
  const glassUnder = ctx.windowLoadDt(false);
  const area = floorAreaFt2(room);
  let ceilingUA = 0;
  let ceilingDt: Float64Array | null = null;
  if (room.above.kind === 'attic') {
    ceilingUA = CEILING_INSULATION[room.above.insulation].value * area;
    ceilingDt = ctx.atticLoadDt(room.above.roofColor ?? 'medium', room.above.radiantBarrier ?? false);
  } else if (room.above.kind === 'roof') {
    ceilingUA = CEILING_INSULATION[room.above.insulation].value * area;
    ceilingDt = ctx.roofLoadDt(room.above.roofColor ?? 'medium');
  }
  const floorUA =
    room.below.kind === 'garage' ? FLOOR_INSULATION[room.below.insulation].value * area * GARAGE_COOLING_FRACTION : 0;
  const floorDt = ctx.floorLoadDt;
  const af = p.altitudeFactor;
  const infCoef = SENSIBLE_CONSTANT * air.summerCfm * af;
  const ventCoef = SENSIBLE_CONSTANT * air.ventCoolingSensibleCfm * af;
  const people = peopleLoad(room);
  const appl = appliancesLoad(room);
  const di = air.defaultInternal;
  const peopleS = roundHalfUp(people.sensible + (di?.peopleSensible ?? 0));
  const applS = roundHalfUp(appl.sensible + (di?.otherSensible ?? 0));
  let peak = 0;
  let peakValue = -1;
  for (let h = 0; h < HOURS; h += 1) {
    const d = dt[h] ?? 0;
    const o = h * K;
    const c0 = r0(pos(walls[h] ?? 0));
    const c1 = r0(pos(glassUAOver * (glassOver[h] ?? 0) + glassUAUnder * (glassUnder[h] ?? 0)));
    const c2 = r0(pos(solar[h] ?? 0));
    const c3 = r0(pos(doors[h] ?? 0));
    const c4 = ceilingDt ? r0(pos(ceilingUA * (ceilingDt[h] ?? 0))) : 0;
    const c5 = r0(pos(floorUA * (floorDt[h] ?? 0)));
    const c6 = r0(pos(infCoef * d));
    const c7 = r0(pos(ventCoef * d));
    table[o] = c0;
    table[o + 1] = c1;
    table[o + 2] = c2;
    table[o + 3] = c3;
    table[o + 4] = c4;
    table[o + 5] = c5;
    table[o + 6] = c6;
    table[o + 7] = c7;
    table[o + 8] = peopleS;
    table[o + 9] = applS;
    table[o + 10] = 0;
    const total = c0 + c1 + c2 + c3 + c4 + c5 + c6 + c7 + peopleS + applS;
    hourly[h] = total;
    if (total > peakValue) {
      peakValue = total;
      peak = h;
    }
  }
  const latCoef = LATENT_CONSTANT * p.deltaGrains * af;
  const latent = toComponents({
    walls: 0,
    windowsConduction: 0,
    windowsSolar: 0,
    doors: 0,
    ceiling: 0,
    floor: 0,
    infiltration: latCoef * air.summerCfm,
    ventilation: latCoef * air.ventLatentCfm,
    people: people.latent + (di?.peopleLatent ?? 0),
    appliances: appl.latent + (di?.otherLatent ?? 0),
    ducts: 0,
  });
  return { room, air, ctx, table, hourly, peakIndex: peak, latent, ductHeatingBtuh: 0 };
}

/** Heating: conduction at the winter ΔT, winter leakage and ventilation; no sun, people or appliance credit. */
export function roomHeating(room: Room, p: DesignPsychrometrics, air: RoomAir, ductsBtuh: number): LoadComponents {
  const { walls, windowsConduction, doors } = exposedWallsLoad(room, p);
  const af = p.altitudeFactor;
  return toComponents({
    walls: walls.heating,
    windowsConduction: windowsConduction.heating,
    windowsSolar: 0,
    doors: doors.heating,
    ceiling: ceilingLoad(room, p).heating,
    floor: floorLoad(room, p).heating,
    infiltration: SENSIBLE_CONSTANT * air.winterCfm * p.heatingDeltaTF * af,
    ventilation: SENSIBLE_CONSTANT * air.ventHeatingCfm * p.heatingDeltaTF * af,
    people: 0,
    appliances: 0,
    ducts: ductsBtuh,
  });
}

/** Builds the room's result from its hourly table, given the home's block hour (index 0–23). */
export function roomLoadFromHourly(w: RoomHourly, p: DesignPsychrometrics, blockIndex: number): RoomLoad {
  const room = w.room;
  const area = floorAreaFt2(room);
  const sensibleGain = componentsFromRow(w.table, w.peakIndex * K);
  const heatLoss = roomHeating(room, p, w.air, w.ductHeatingBtuh);
  const hourlySensibleBtuh: number[] = [];
  for (let h = 0; h < HOURS; h += 1) hourlySensibleBtuh.push(w.hourly[h] ?? 0);
  return {
    roomId: room.id,
    roomName: room.name,
    floorAreaFt2: roundHalfUp(area, 1),
    volumeFt3: roundHalfUp(area * room.ceilingHeightFt, 0),
    infiltrationCfm: roundHalfUp(w.air.summerCfm, 1),
    infiltrationHeatingCfm: roundHalfUp(w.air.winterCfm, 1),
    ventilationCfm: roundHalfUp(w.air.ventCfm, 1),
    peakHour: w.peakIndex + 1,
    hourlySensibleBtuh,
    sensibleGain,
    latentGain: w.latent,
    heatLoss,
    coolingTotalBtuh: sensibleGain.total + w.latent.total,
    atBlock: { hour: blockIndex + 1, sensibleBtuh: w.hourly[blockIndex] ?? 0, latentBtuh: w.latent.total },
    atPeak: peakDetail(w, sensibleGain),
    notes: METHOD_NOTES,
    isEstimate: true,
  };
}

/** Sun through glass of a room at one hour index (0–23), Btu/h (rounded). */
export function roomSolarAt(w: RoomHourly, index: number): number {
  return w.table[index * K + 2] ?? 0;
}

/** Sensible components of a room at one hour index (0–23), for the block breakdown. */
export function roomComponentsAt(w: RoomHourly, index: number): LoadComponents {
  return componentsFromRow(w.table, index * K);
}

/**
 * One room on its own: its leakage is its own exposed surface × the tightness's unit leakage area, driven by its
 * own ceiling height as the stack (infiltration.ts), none when it is interior; no ventilation share and no default
 * internal gains (those are whole-home terms — use homeLoad for them).
 */
export function roomLoadFromParsed(
  room: Room,
  p: DesignPsychrometrics,
  ctx: DesignDayContext,
  tightness: Tightness,
): RoomLoad {
  let winterCfm: number;
  let summerCfm: number;
  if (room.achOverride !== undefined)
    summerCfm = winterCfm = (room.achOverride * floorAreaFt2(room) * room.ceilingHeightFt) / 60;
  else {
    const leakageAreaCm2 = leakageAreaFromTightnessCm2(exposedEnvelopeFt2(room), tightness);
    const leak = (deltaTF: number, season: 'heating' | 'cooling') =>
      designLeakageCfm({ leakageAreaCm2, stackHeightFt: room.ceilingHeightFt, deltaTF, season });
    winterCfm = leak(p.heatingDeltaTF, 'heating');
    summerCfm = leak(p.coolingDeltaTF, 'cooling');
  }
  const air: RoomAir = {
    summerCfm,
    winterCfm,
    ventCfm: 0,
    ventCoolingSensibleCfm: 0,
    ventLatentCfm: 0,
    ventHeatingCfm: 0,
  };
  const w = roomHourly(room, p, ctx, air);
  return roomLoadFromHourly(w, p, w.peakIndex);
}

/**
 * One room's sensible and latent heat gain (at its own peak hour of the design day) and heat loss,
 * Btu/h, by component. Validates the room and conditions (throws CalcError INVALID_INPUT with field
 * details). Method: see METHOD_NOTES. Each component rounded half-up to 1 Btu/h.
 */
export function roomLoad({
  room,
  designConditions,
  tightness = 'average',
}: {
  readonly room: RoomInput;
  readonly designConditions: DesignConditionsInput;
  readonly tightness?: Tightness;
}): RoomLoad {
  const r = parseOrThrow(roomInputSchema, room);
  const c = parseOrThrow(designConditionsSchema, designConditions);
  const t = parseOrThrow(tightnessSchema, tightness);
  return roomLoadFromParsed(r, designPsychrometrics(c), designDayContext(c), t);
}
