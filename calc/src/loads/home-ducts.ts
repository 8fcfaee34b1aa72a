import type { DuctSystem } from '../schemas/ducts';
import type { Home } from '../schemas/home';
import { BTUH_PER_TON } from '../units';
import type { DesignPsychrometrics } from './conditions';
import { HOURS, type DesignDayContext } from './design-day-context';
import { DUCT_CFM_PER_TON, ductLoadFromParsed, type DuctLoad } from './ducts';
import { apportion, apportionShare } from './peak-detail';
import { COMPONENT_COUNT, roomHeating, type RoomHourly } from './room-load';

/** The home's ducted system: its duct loads at the block hour and the rooms it serves. */
export interface HomeDucts extends DuctLoad {
  readonly roomIds: readonly string[];
}

const DUCT_COLUMN = COMPONENT_COUNT - 1;

/**
 * The home's ducted systems' ducts, in order: an option's list (one per ducted system, each with its rooms), else
 * the walk-through's one entry, else none. The schema keeps each room on one system's ducts at most, so each
 * system's figures come from its own rooms alone — the same as the one-system method for those rooms.
 */
export function ductSystemsOf(home: Pick<Home, 'ducts' | 'ductSystems'>): readonly DuctSystem[] {
  if (home.ductSystems && home.ductSystems.length > 0) return home.ductSystems;
  return home.ducts ? [home.ducts] : [];
}

/** The ducted system's figures for the home's rooms before any room's share: what depends only on the served rooms' sums. */
export interface HomeDuctHours {
  /** Indices (in the rooms' order) of the rooms the system serves. */
  readonly served: readonly number[];
  /** The duct figures for each hour index, from that hour's coincident sensible gain of the served rooms. */
  readonly byHour: readonly DuctLoad[];
  /** Hour index of the served rooms' coincident sensible peak (before ducts): the latent and heating figures are this hour's. */
  readonly peak: number;
  /** Each served room's heat loss before ducts, Btu/h (in `served` order): the heating loss is shared by these. */
  readonly heat: readonly number[];
}

/**
 * The ducted system's gains and losses hour by hour from the served rooms' sums (the first half of
 * `applyDucts`, without sharing them): the blower airflow is fixed for the day — entered, else 400 cfm
 * per ton of the served rooms' coincident cooling peak (their heat loss when they have no cooling
 * load) — and each hour's duct gain is that of the hour's coincident sensible load (attic air and
 * outdoor temperature of the hour). `heatOf(i)` may give room i's heat loss before ducts when the
 * caller holds it (the live path); else it is worked out. [OWN: stated rule; method in ducts.ts]
 */
export function ductHours(
  ducts: DuctSystem,
  work: readonly RoomHourly[],
  psy: DesignPsychrometrics,
  ctx: DesignDayContext,
  areas: readonly number[],
  heatOf?: (index: number) => number,
): HomeDuctHours {
  const wanted = ducts.roomIds ? new Set(ducts.roomIds) : null;
  const served: number[] = [];
  work.forEach((w, i) => {
    if (!wanted || wanted.has(w.room.id)) served.push(i);
  });
  const sum = new Float64Array(HOURS);
  let latent = 0;
  let floor = 0;
  const levels = new Set<number>();
  const heat: number[] = [];
  let heating = 0;
  for (const i of served) {
    const w = work[i];
    if (!w) continue;
    for (let h = 0; h < HOURS; h += 1) sum[h] = (sum[h] ?? 0) + (w.hourly[h] ?? 0);
    latent += w.latent.total;
    floor += areas[i] ?? 0;
    if (w.room.floorLevel >= 1) levels.add(w.room.floorLevel);
    const hl = heatOf ? heatOf(i) : roomHeating(w.room, psy, w.air, 0).total;
    heat.push(hl);
    heating += hl;
  }
  let peak = 0;
  for (let h = 1; h < HOURS; h += 1) if ((sum[h] ?? 0) > (sum[peak] ?? 0)) peak = h;
  const cooling = (sum[peak] ?? 0) + latent;
  const airflowCfm = ducts.airflowCfm ?? (DUCT_CFM_PER_TON * (cooling > 0 ? cooling : heating)) / BTUH_PER_TON;
  const fixed: DuctSystem = {
    location: ducts.location,
    insulationR: ducts.insulationR,
    leakage: ducts.leakage,
    supplyLeakageFraction: ducts.supplyLeakageFraction,
    returnLeakageFraction: ducts.returnLeakageFraction,
    supplyAreaFt2: ducts.supplyAreaFt2,
    returnAreaFt2: ducts.returnAreaFt2,
    airflowCfm: airflowCfm > 0 ? airflowCfm : undefined,
    roofColor: ducts.roofColor,
    radiantBarrier: ducts.radiantBarrier,
  };
  const byHour: DuctLoad[] = [];
  for (let h = 0; h < HOURS; h += 1)
    byHour.push(
      ductLoadFromParsed(fixed, psy, ctx, {
        hour: h + 1,
        sensibleBtuh: sum[h] ?? 0,
        latentBtuh: latent,
        heatingBtuh: heating,
        floorAreaFt2: floor,
        storeys: Math.max(1, levels.size),
      }),
    );
  return { served, byHour, peak, heat };
}

/** A room's work with its duct shares: the same table and hours (copied), its peak hour again, latent and heating shares. */
function withShares(
  w: RoomHourly,
  table: Float64Array,
  hourly: Float64Array,
  latentDucts: number,
  heating: number,
): RoomHourly {
  let p = 0;
  for (let h = 1; h < HOURS; h += 1) if ((hourly[h] ?? 0) > (hourly[p] ?? 0)) p = h;
  return {
    room: w.room,
    air: w.air,
    ctx: w.ctx,
    table,
    hourly,
    peakIndex: p,
    latent: {
      walls: w.latent.walls,
      windowsConduction: w.latent.windowsConduction,
      windowsSolar: w.latent.windowsSolar,
      doors: w.latent.doors,
      ceiling: w.latent.ceiling,
      floor: w.latent.floor,
      infiltration: w.latent.infiltration,
      ventilation: w.latent.ventilation,
      people: w.latent.people,
      appliances: w.latent.appliances,
      ducts: latentDucts,
      total: w.latent.total + latentDucts,
    },
    ductHeatingBtuh: heating,
  };
}

/**
 * Adds a ducted system's duct gains and losses to the rooms it serves (figures from `ductHours`):
 * each hour's duct gain is shared among the served rooms by their sensible gain that hour; the latent
 * gain by their latent gain and the heating loss by their heat loss (largest remainder, so the rooms
 * add up to the duct figure). [OWN: stated sharing rule; method in ducts.ts]
 * Returns new room work (tables updated in place) and the duct figures for each hour index.
 */
export function applyDucts(
  ducts: DuctSystem,
  work: readonly RoomHourly[],
  psy: DesignPsychrometrics,
  ctx: DesignDayContext,
  areas: readonly number[],
): { work: RoomHourly[]; byHour: DuctLoad[]; roomIds: string[] } {
  const { served, byHour, peak, heat } = ductHours(ducts, work, psy, ctx, areas);
  const raws = new Float64Array(served.length);
  for (let h = 0; h < HOURS; h += 1) {
    served.forEach((i, k) => {
      raws[k] = work[i]?.hourly[h] ?? 0;
    });
    const shares = apportion(byHour[h]?.cooling.sensibleBtuh ?? 0, raws);
    served.forEach((i, j) => {
      const w = work[i];
      const x = shares[j] ?? 0;
      if (!w || x === 0) return;
      w.table[h * COMPONENT_COUNT + DUCT_COLUMN] = x;
      w.hourly[h] = (w.hourly[h] ?? 0) + x;
    });
  }
  const atPeak = byHour[peak];
  const latentShares = apportion(
    atPeak?.cooling.latentBtuh ?? 0,
    served.map((i) => work[i]?.latent.total ?? 0),
  );
  const heatShares = apportion(atPeak?.heating.btuh ?? 0, heat);
  const next = work.slice();
  served.forEach((i, j) => {
    const w = work[i];
    if (!w) return;
    next[i] = withShares(w, w.table, w.hourly, latentShares[j] ?? 0, heatShares[j] ?? 0);
  });
  return { work: next, byHour: byHour.slice(), roomIds: served.map((i) => work[i]?.room.id ?? '') };
}

/**
 * One room's work with its duct shares, exactly `applyDucts(…).work[index]` for the same rooms, from
 * the system's figures (`ductHours`) and the rooms' work before ducts — which stays unchanged (the
 * room's table and hours are copied). Each share is `apportionShare`: one pass over the served rooms,
 * no sharing out among the others. A room the system does not serve comes back as it is.
 */
export function roomWithDucts(d: HomeDuctHours, work: readonly RoomHourly[], index: number): RoomHourly | undefined {
  const w = work[index];
  const j = d.served.indexOf(index);
  if (!w || j < 0) return w;
  const n = d.served.length;
  const table = w.table.slice();
  const hourly = w.hourly.slice();
  const raws = new Float64Array(n);
  for (let h = 0; h < HOURS; h += 1) {
    for (let k = 0; k < n; k += 1) raws[k] = work[d.served[k] ?? -1]?.hourly[h] ?? 0;
    const x = apportionShare(d.byHour[h]?.cooling.sensibleBtuh ?? 0, raws, j);
    if (x === 0) continue;
    table[h * COMPONENT_COUNT + DUCT_COLUMN] = x;
    hourly[h] = (hourly[h] ?? 0) + x;
  }
  const atPeak = d.byHour[d.peak];
  for (let k = 0; k < n; k += 1) raws[k] = work[d.served[k] ?? -1]?.latent.total ?? 0;
  const latent = apportionShare(atPeak?.cooling.latentBtuh ?? 0, raws, j);
  return withShares(w, table, hourly, latent, apportionShare(atPeak?.heating.btuh ?? 0, d.heat, j));
}
