import { ventilationCfm62_2 } from '../air';
import { CalcError } from '../errors';
import { floorAreaFt2 } from '../geometry';
import { parseOrThrow } from '../parse';
import { roundHalfUp } from '../rounding';
import { homeInputSchema, type Home, type HomeInput, type VentilationKind } from '../schemas/home';
import { BTUH_PER_TON } from '../units';
import { designPsychrometrics, type DesignPsychrometrics } from './conditions';
import { designDayContext, HOURS, type DesignDayContext } from './design-day-context';
import { DEFAULT_RECOVERY_SENSIBLE, RLF_INTERNAL, type RtsConstruction } from './hourly-method';
import {
  designLeakageCfm,
  houseStackHeightFt,
  leakageAreaFromCfm50Cm2,
  leakageAreaFromTightnessCm2,
} from './infiltration';
import { METHOD_NOTES } from './notes';
import { applyDucts, ductSystemsOf, type HomeDucts } from './home-ducts';
import {
  exposedEnvelopeFt2,
  roomComponentsAt,
  roomSolarAt,
  roomHourly,
  roomLoadFromHourly,
  type LoadComponents,
  type RoomAir,
  type RoomHourly,
  type RoomLoad,
} from './room-load';

/** One hour of the design day for the whole home. */
export interface HomeHour {
  readonly hour: number;
  readonly outdoorDryBulbF: number;
  readonly sensibleBtuh: number;
  readonly latentBtuh: number;
  readonly windowsSolarBtuh: number;
}

/** Whole-home estimated loads. Cooling totals are the block (coincident) load at the home's peak hour. */
export interface HomeLoad {
  readonly rooms: readonly RoomLoad[];
  /** Sensible gain of all rooms at the block hour, by component. */
  readonly sensibleGain: LoadComponents;
  readonly latentGain: LoadComponents;
  readonly heatLoss: LoadComponents;
  readonly totals: {
    readonly sensibleBtuh: number;
    readonly latentBtuh: number;
    readonly coolingBtuh: number;
    readonly heatingBtuh: number;
    /** Sensible ÷ total cooling, 3 decimals (half-up); 1 when there is no cooling load. */
    readonly sensibleHeatRatio: number;
    /** Cooling Btu/h ÷ 12,000, 2 decimals (half-up). */
    readonly coolingTons: number;
    readonly floorAreaFt2: number;
  };
  /** The block load: the hour at which the sum of all rooms peaks. */
  readonly block: {
    readonly hour: number;
    readonly sensibleBtuh: number;
    readonly latentBtuh: number;
    readonly coolingBtuh: number;
    /** Sum of each room's own sensible peak (what sizing by room peaks would use). */
    readonly sumOfRoomPeaksSensibleBtuh: number;
  };
  readonly hourly: readonly HomeHour[];
  readonly designDay: {
    readonly latitudeDeg: number;
    readonly latitudeAssumed: boolean;
    readonly month: number;
    readonly dayOfYear: number;
    readonly tauB: number;
    readonly tauD: number;
    readonly skySource: string;
    readonly skyIsGeneric: boolean;
    /** The construction class whose radiant time factors store the heat, and whether it is the default (none chosen). */
    readonly thermalMass: RtsConstruction;
    readonly thermalMassAssumed: boolean;
    /** Some room has basement walls or a basement floor below grade. */
    readonly belowGrade: boolean;
    /** Design ground surface temperature used below grade, °F, and whether it is the outdoor heating design stand-in. */
    readonly groundDesignF: number;
    readonly groundAssumed: boolean;
  };
  readonly air: {
    readonly winterAch: number;
    readonly summerAch: number;
    readonly winterCfm: number;
    readonly summerCfm: number;
    /** Effective leakage area at 4 Pa, in² (from the tightness and exposed surface, or the blower-door CFM50). */
    readonly leakageAreaIn2: number;
    /** The house's stack height, ft (the driving force's H). */
    readonly stackHeightFt: number;
    readonly leakageBasis: 'tightness' | 'blower-door';
    readonly ventilationKind: VentilationKind;
    readonly ventilationCfm: number;
    readonly bedrooms: number;
  };
  readonly internalGains: {
    /** True when no room had people or appliances entered and the whole-home default was used. */
    readonly defaulted: boolean;
    readonly occupants: number;
    readonly sensibleBtuh: number;
    readonly latentBtuh: number;
  };
  readonly psychrometrics: {
    readonly pressurePsia: number;
    readonly altitudeFactor: number;
    readonly indoorGrains: number;
    readonly outdoorGrains: number;
    readonly deltaGrains: number;
    readonly indoorDewPointF: number;
  };
  /** The (first) ducted system's duct gains (at the block hour) and losses, or null when the home has none entered. */
  readonly ducts: HomeDucts | null;
  /** Each ducted system's duct gains (at the block hour) and losses, in the order of the home's ducts (`ductSystemsOf`). */
  readonly ductSystems: readonly HomeDucts[];
  readonly notes: readonly string[];
  readonly isEstimate: true;
}

/** Adds room component sets key by key (integers, so the home total equals the sum of rooms). */
function sumComponents(sets: readonly LoadComponents[]): LoadComponents {
  let walls = 0,
    windowsConduction = 0,
    windowsSolar = 0,
    doors = 0,
    ceiling = 0,
    floor = 0,
    infiltration = 0,
    ventilation = 0,
    people = 0,
    appliances = 0,
    ducts = 0,
    total = 0;
  for (const c of sets) {
    walls += c.walls;
    windowsConduction += c.windowsConduction;
    windowsSolar += c.windowsSolar;
    doors += c.doors;
    ceiling += c.ceiling;
    floor += c.floor;
    infiltration += c.infiltration;
    ventilation += c.ventilation;
    people += c.people;
    appliances += c.appliances;
    ducts += c.ducts;
    total += c.total;
  }
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

/** Bedrooms: entered, else the rooms whose name says "bed", at least 1. [OWN: stated rule] */
export function homeBedrooms(home: Home): number {
  if (home.bedrooms !== undefined) return home.bedrooms;
  let n = 0;
  for (const r of home.rooms) if (/bed/i.test(r.name)) n += 1;
  return Math.max(1, n);
}

/**
 * Ventilation air that loads the house, CFM, by system [MEM: ASHRAE Fundamentals ch. 16 combination of
 * unbalanced ventilation with leakage: Q = max(Q_unbal, Q_inf + ½·Q_unbal)]:
 * - none: 0; balanced: Q; ERV/HRV: Q·(1 − ε) (sensible; latent with the latent effectiveness, HRV 0);
 * - exhaust or supply: the part above leakage, max(Q − Q_inf, ½·Q) — season by season.
 */
function ventilationLoads(home: Home, q: number, summerInf: number, winterInf: number) {
  const v = home.ventilation;
  const kind = v?.kind ?? 'none';
  if (kind === 'none' || q <= 0) return { cooling: 0, latent: 0, heating: 0 };
  if (kind === 'balanced') return { cooling: q, latent: q, heating: q };
  if (kind === 'erv-hrv') {
    const es = v?.sensibleEffectiveness ?? DEFAULT_RECOVERY_SENSIBLE;
    const el = v?.latentEffectiveness ?? 0;
    return { cooling: q * (1 - es), latent: q * (1 - el), heating: q * (1 - es) };
  }
  const s = Math.max(q - summerInf, 0.5 * q);
  return { cooling: s, latent: s, heating: Math.max(q - winterInf, 0.5 * q) };
}

/** The whole-home work before rounding into the result: each room's hourly table and the block hour. */
export interface HomeWork {
  readonly rooms: readonly RoomHourly[];
  readonly blockIndex: number;
  readonly houseHourly: Float64Array;
}

/**
 * The block hour of a set of room hourly profiles (index 0–23, earliest on ties) and its sum: the
 * live path recombines the block after one room's hours change without recomputing the others.
 */
export function recombineBlock(profiles: readonly ArrayLike<number>[]): { index: number; sensibleBtuh: number } {
  const sum = new Float64Array(HOURS);
  for (const p of profiles) for (let h = 0; h < HOURS; h += 1) sum[h] = (sum[h] ?? 0) + (p[h] ?? 0);
  let best = 0;
  for (let h = 1; h < HOURS; h += 1) if ((sum[h] ?? 0) > (sum[best] ?? 0)) best = h;
  return { index: best, sensibleBtuh: sum[best] ?? 0 };
}

/** The house-level air and internal-gain figures and each room's share of them (before any hourly work). */
export interface HouseAir {
  readonly airs: readonly RoomAir[];
  readonly areas: readonly number[];
  readonly floorArea: number;
  readonly winterAch: number;
  readonly summerAch: number;
  readonly winterHouse: number;
  readonly summerHouse: number;
  readonly leakageAreaCm2: number;
  readonly stackHeightFt: number;
  readonly leakageBasis: 'tightness' | 'blower-door';
  readonly bedrooms: number;
  readonly ventKind: VentilationKind;
  readonly ventCfm: number;
  readonly anyInternal: boolean;
  readonly occupants: number;
}

/**
 * The house's design leakage in both seasons from one effective leakage area (the tightness × exposed surface,
 * or the blower-door CFM50; see infiltration.ts) shared by exposed envelope, its ventilation and (when no room
 * has people or appliances) the default internal gains, as each room's air: no hourly work, so the live path
 * can tell which rooms' hours must be redone.
 */
export function houseAir(home: Home): HouseAir {
  let volume = 0;
  let floorArea = 0;
  let exposedTotal = 0;
  const exposed: number[] = [];
  const areas: number[] = [];
  const storeys: { floorLevel: number; ceilingHeightFt: number; areaFt2: number }[] = [];
  for (const r of home.rooms) {
    const a = floorAreaFt2(r);
    areas.push(a);
    floorArea += a;
    volume += a * r.ceilingHeightFt;
    storeys.push({ floorLevel: r.floorLevel, ceilingHeightFt: r.ceilingHeightFt, areaFt2: a });
    const e = r.achOverride === undefined ? exposedEnvelopeFt2(r) : 0;
    exposed.push(e);
    exposedTotal += e;
  }
  const leakageBasis = home.blowerDoorCfm50 !== undefined ? 'blower-door' : 'tightness';
  const leakageAreaCm2 =
    home.blowerDoorCfm50 !== undefined
      ? leakageAreaFromCfm50Cm2(home.blowerDoorCfm50)
      : leakageAreaFromTightnessCm2(exposedTotal, home.tightness);
  const stackHeightFt = houseStackHeightFt(storeys);
  const c = home.designConditions;
  const leak = (areaCm2: number, deltaTF: number, season: 'heating' | 'cooling') =>
    designLeakageCfm({ leakageAreaCm2: areaCm2, stackHeightFt, deltaTF, season });
  const heatingDeltaTF = c.indoorHeatingF - c.outdoorHeatingDryBulbF;
  const coolingDeltaTF = c.outdoorCoolingDryBulbF - c.indoorCoolingF;
  const winterHouse = leak(leakageAreaCm2, heatingDeltaTF, 'heating');
  const summerHouse = leak(leakageAreaCm2, coolingDeltaTF, 'cooling');
  // Each room's share by exposed surface, as a rate per ft²: under the tightness a room's leakage is its own
  // surface × the unit leakage area (no other room's edit moves it); a blower-door figure is the house's, shared.
  const perFt2 = leakageBasis === 'tightness' ? leakageAreaFromTightnessCm2(1, home.tightness) : 0;
  const winterPerFt2 =
    leakageBasis === 'tightness'
      ? leak(perFt2, heatingDeltaTF, 'heating')
      : exposedTotal > 0
        ? winterHouse / exposedTotal
        : 0;
  const summerPerFt2 =
    leakageBasis === 'tightness'
      ? leak(perFt2, coolingDeltaTF, 'cooling')
      : exposedTotal > 0
        ? summerHouse / exposedTotal
        : 0;
  const winterAch = volume > 0 ? (winterHouse * 60) / volume : 0;
  const summerAch = volume > 0 ? (summerHouse * 60) / volume : 0;
  const bedrooms = homeBedrooms(home);
  const ventKind = home.ventilation?.kind ?? 'none';
  const q =
    ventKind === 'none' ? 0 : (home.ventilation?.cfm ?? ventilationCfm62_2({ floorAreaFt2: floorArea, bedrooms }));
  const vent = ventilationLoads(home, q, summerHouse, winterHouse);

  let anyInternal = false;
  for (const r of home.rooms) if (r.occupants > 0 || r.appliances.length > 0) anyInternal = true;
  const occupants = bedrooms + 1;
  const kitchens = home.rooms.filter((r) => /kitchen/i.test(r.name));
  const kitchenArea = kitchens.reduce((s, r) => s + floorAreaFt2(r), 0);

  const airs: RoomAir[] = [];
  home.rooms.forEach((room, i) => {
    const a = areas[i] ?? 0;
    const areaShare = floorArea > 0 ? a / floorArea : 0;
    let winterCfm: number;
    let summerCfm: number;
    if (room.achOverride !== undefined) summerCfm = winterCfm = (room.achOverride * a * room.ceilingHeightFt) / 60;
    else {
      winterCfm = winterPerFt2 * (exposed[i] ?? 0);
      summerCfm = summerPerFt2 * (exposed[i] ?? 0);
    }
    let defaultInternal: RoomAir['defaultInternal'];
    if (!anyInternal) {
      // Base part to the kitchen(s) by their area (all rooms when none is named so); area and people parts by area.
      const baseShare = kitchenArea > 0 ? (/kitchen/i.test(room.name) ? a / kitchenArea : 0) : areaShare;
      defaultInternal = {
        peopleSensible: RLF_INTERNAL.sensiblePerOccupant * occupants * areaShare,
        peopleLatent: RLF_INTERNAL.latentPerOccupant * occupants * areaShare,
        otherSensible: RLF_INTERNAL.sensibleBase * baseShare + RLF_INTERNAL.sensiblePerFt2 * a,
        otherLatent: RLF_INTERNAL.latentBase * baseShare + RLF_INTERNAL.latentPerFt2 * a,
      };
    }
    airs.push({
      summerCfm,
      winterCfm,
      ventCfm: q * areaShare,
      ventCoolingSensibleCfm: vent.cooling * areaShare,
      ventLatentCfm: vent.latent * areaShare,
      ventHeatingCfm: vent.heating * areaShare,
      defaultInternal,
    });
  });
  return {
    airs,
    areas,
    floorArea,
    winterAch,
    summerAch,
    winterHouse,
    summerHouse,
    leakageAreaCm2,
    stackHeightFt,
    leakageBasis,
    bedrooms,
    ventKind,
    ventCfm: q,
    anyInternal,
    occupants,
  };
}

/** Whole-home loads from a parsed home (engine path; no validation). */
export function homeLoadFromParsed(
  home: Home,
  psy: DesignPsychrometrics = designPsychrometrics(home.designConditions),
  ctx: DesignDayContext = designDayContext(home.designConditions, home.thermalMass),
): HomeLoad {
  const air = houseAir(home);
  return homeLoadFromWork(
    home,
    psy,
    ctx,
    air,
    home.rooms.map((room, i) => roomHourly(room, psy, ctx, air.airs[i] ?? NO_AIR)),
  );
}

const NO_AIR: RoomAir = {
  summerCfm: 0,
  winterCfm: 0,
  ventCfm: 0,
  ventCoolingSensibleCfm: 0,
  ventLatentCfm: 0,
  ventHeatingCfm: 0,
};

/** The rooms' hours with the ducted system's shares added (tables changed in place), the house's hours and the block hour. */
export function blockOfWork(
  home: Home,
  psy: DesignPsychrometrics,
  ctx: DesignDayContext,
  areas: readonly number[],
  roomWork: readonly RoomHourly[],
): {
  work: RoomHourly[];
  ductsByHour: ReturnType<typeof applyDucts>[];
  houseHourly: Float64Array;
  block: number;
} {
  let work: RoomHourly[] = roomWork.slice();
  const houseHourly = new Float64Array(HOURS);
  // Each system in turn: its rooms are no other system's, so it reads only its own rooms' work before ducts.
  const ductsByHour: ReturnType<typeof applyDucts>[] = [];
  for (const ducts of ductSystemsOf(home)) {
    const applied = applyDucts(ducts, work, psy, ctx, areas);
    ductsByHour.push(applied);
    work = applied.work;
  }
  for (const w of work) for (let h = 0; h < HOURS; h += 1) houseHourly[h] = (houseHourly[h] ?? 0) + (w.hourly[h] ?? 0);
  let block = 0;
  for (let h = 1; h < HOURS; h += 1) if ((houseHourly[h] ?? 0) > (houseHourly[block] ?? 0)) block = h;
  return { work, ductsByHour, houseHourly, block };
}

/**
 * The home's result from each room's hourly work (before ducts, in the home's room order): the ducts
 * added to the served rooms, the block hour, and every figure. The work's tables are changed in place
 * by the ducts; the live path hands in copies.
 */
export function homeLoadFromWork(
  home: Home,
  psy: DesignPsychrometrics,
  ctx: DesignDayContext,
  air: HouseAir,
  roomWork: readonly RoomHourly[],
): HomeLoad {
  const { areas, floorArea, winterAch, summerAch, winterHouse, summerHouse, leakageBasis, bedrooms, ventKind } = air;
  const anyInternal = air.anyInternal;
  const q = air.ventCfm;
  const occupants = air.occupants;
  const { work, ductsByHour, houseHourly, block } = blockOfWork(home, psy, ctx, areas, roomWork);

  const rooms = work.map((w) => roomLoadFromHourly(w, psy, block));
  const ductSystems = ductsByHour.flatMap((d) => ductsFigures(d, block) ?? []);
  const sensibleGain = sumComponents(work.map((w) => roomComponentsAt(w, block)));
  const latentGain = sumComponents(rooms.map((r) => r.latentGain));
  const heatLoss = sumComponents(rooms.map((r) => r.heatLoss));
  const cooling = sensibleGain.total + latentGain.total;
  let sumPeaks = 0;
  for (const r of rooms) sumPeaks += r.sensibleGain.total;
  const hourly: HomeHour[] = [];
  for (let h = 0; h < HOURS; h += 1) {
    let solar = 0;
    for (const w of work) solar += roomSolarAt(w, h);
    hourly.push({
      hour: h + 1,
      outdoorDryBulbF: roundHalfUp(ctx.outdoorF[h] ?? 0, 1),
      sensibleBtuh: houseHourly[h] ?? 0,
      latentBtuh: latentGain.total,
      windowsSolarBtuh: solar,
    });
  }
  const internalS = anyInternal
    ? 0
    : RLF_INTERNAL.sensibleBase +
      RLF_INTERNAL.sensiblePerFt2 * floorArea +
      RLF_INTERNAL.sensiblePerOccupant * occupants;
  const internalL = anyInternal
    ? 0
    : RLF_INTERNAL.latentBase + RLF_INTERNAL.latentPerFt2 * floorArea + RLF_INTERNAL.latentPerOccupant * occupants;
  return {
    rooms,
    sensibleGain,
    latentGain,
    heatLoss,
    totals: {
      sensibleBtuh: sensibleGain.total,
      latentBtuh: latentGain.total,
      coolingBtuh: cooling,
      heatingBtuh: heatLoss.total,
      sensibleHeatRatio: cooling > 0 ? roundHalfUp(sensibleGain.total / cooling, 3) : 1,
      coolingTons: roundHalfUp(cooling / BTUH_PER_TON, 2),
      floorAreaFt2: roundHalfUp(
        rooms.reduce((s, r) => s + r.floorAreaFt2, 0),
        1,
      ),
    },
    block: {
      hour: block + 1,
      sensibleBtuh: sensibleGain.total,
      latentBtuh: latentGain.total,
      coolingBtuh: cooling,
      sumOfRoomPeaksSensibleBtuh: sumPeaks,
    },
    hourly,
    designDay: {
      latitudeDeg: ctx.latitudeDeg,
      latitudeAssumed: ctx.latitudeAssumed,
      month: ctx.month,
      dayOfYear: ctx.dayOfYear,
      tauB: ctx.tauB,
      tauD: ctx.tauD,
      skySource: ctx.skySource,
      skyIsGeneric: ctx.skyIsGeneric,
      thermalMass: ctx.construction,
      thermalMassAssumed: home.thermalMass === undefined,
      belowGrade: home.rooms.some(
        (r) => r.below.kind === 'basement-floor' || r.exposedWalls.some((w) => (w.belowGradeFt ?? 0) > 0),
      ),
      groundDesignF: home.designConditions.groundDesignF ?? home.designConditions.outdoorHeatingDryBulbF,
      groundAssumed: psy.groundAssumed,
    },
    air: {
      winterAch: roundHalfUp(winterAch, 3),
      summerAch: roundHalfUp(summerAch, 3),
      winterCfm: roundHalfUp(winterHouse, 1),
      summerCfm: roundHalfUp(summerHouse, 1),
      leakageAreaIn2: roundHalfUp(air.leakageAreaCm2 / 6.4516, 1),
      stackHeightFt: roundHalfUp(air.stackHeightFt, 2),
      leakageBasis,
      ventilationKind: ventKind,
      ventilationCfm: roundHalfUp(q, 1),
      bedrooms,
    },
    internalGains: {
      defaulted: !anyInternal,
      occupants: anyInternal ? home.rooms.reduce((s, r) => s + r.occupants, 0) : occupants,
      sensibleBtuh: roundHalfUp(internalS),
      latentBtuh: roundHalfUp(internalL),
    },
    psychrometrics: {
      pressurePsia: roundHalfUp(psy.pressurePsia, 3),
      altitudeFactor: roundHalfUp(psy.altitudeFactor, 4),
      indoorGrains: roundHalfUp(psy.indoorGrains, 2),
      outdoorGrains: roundHalfUp(psy.outdoorGrains, 2),
      deltaGrains: roundHalfUp(psy.deltaGrains, 2),
      indoorDewPointF: roundHalfUp(psy.indoorDewPointF, 2),
    },
    ducts: ductSystems[0] ?? null,
    ductSystems,
    notes: METHOD_NOTES,
    isEstimate: true,
  };
}

/** The duct figures at the block hour (the served rooms' shares at that hour add up to its sensible gain). */
function ductsFigures(d: ReturnType<typeof applyDucts>, block: number): HomeDucts | null {
  const at = d.byHour[block];
  if (!at) return null;
  return { ...at, roomIds: d.roomIds };
}

/**
 * Whole-home sensible/latent heat gain (the block load at the home's peak hour of the design day)
 * and heat loss, Btu/h, with per-room figures (each room's own peak) and per-component breakdowns,
 * the hourly profile, sensible heat ratio and tons. Validates the home (CalcError INVALID_INPUT with
 * field paths). Rounding: components to 1 Btu/h, totals are sums.
 */
export function homeLoad({ home }: { readonly home: HomeInput }): HomeLoad {
  return homeLoadFromParsed(parseOrThrow(homeInputSchema, home));
}

/** The coincident load of a group of rooms: the hour at which their summed sensible gain peaks. */
export interface CoincidentLoad {
  readonly hour: number;
  readonly sensibleBtuh: number;
  readonly latentBtuh: number;
  readonly coolingBtuh: number;
  readonly heatingBtuh: number;
  /** Sum of the group's rooms' own sensible peaks (≥ sensibleBtuh). */
  readonly sumOfRoomPeaksSensibleBtuh: number;
  readonly hourlySensibleBtuh: readonly number[];
}

/**
 * Coincident (block) load of any group of a home's rooms — what one system serving them meets.
 * Throws UNKNOWN_ROOM (path `roomIds[i]`) for an id not in the loads. Latent and heating add up.
 */
export function coincidentLoad({
  loads,
  roomIds,
}: {
  readonly loads: Pick<HomeLoad, 'rooms'>;
  readonly roomIds: readonly string[];
}): CoincidentLoad {
  const byId = new Map<string, RoomLoad>();
  for (const r of loads.rooms) byId.set(r.roomId, r);
  const hourly = new Array<number>(HOURS).fill(0);
  let latent = 0;
  let heating = 0;
  let sumPeaks = 0;
  roomIds.forEach((id, i) => {
    const r = byId.get(id);
    if (!r) throw new CalcError('UNKNOWN_ROOM', [{ path: ['roomIds', i], message: `Room "${id}" is not in the home` }]);
    for (let h = 0; h < HOURS; h += 1) hourly[h] = (hourly[h] ?? 0) + (r.hourlySensibleBtuh[h] ?? 0);
    latent += r.latentGain.total;
    heating += r.heatLoss.total;
    sumPeaks += r.sensibleGain.total;
  });
  let best = 0;
  for (let h = 1; h < HOURS; h += 1) if ((hourly[h] ?? 0) > (hourly[best] ?? 0)) best = h;
  const sensible = hourly[best] ?? 0;
  return {
    hour: best + 1,
    sensibleBtuh: sensible,
    latentBtuh: latent,
    coolingBtuh: sensible + latent,
    heatingBtuh: heating,
    sumOfRoomPeaksSensibleBtuh: sumPeaks,
    hourlySensibleBtuh: hourly,
  };
}
