import type { DuctSystem } from '../schemas/ducts';
import { BTUH_PER_TON } from '../units';
import type { DesignPsychrometrics } from './conditions';
import { HOURS, type DesignDayContext } from './design-day-context';
import { DUCT_CFM_PER_TON, ductLoadFromParsed, type DuctLoad } from './ducts';
import { apportion } from './peak-detail';
import { COMPONENT_COUNT, roomHeating, type RoomHourly } from './room-load';

/** The home's ducted system: its duct loads at the block hour and the rooms it serves. */
export interface HomeDucts extends DuctLoad {
  readonly roomIds: readonly string[];
}

const DUCT_COLUMN = COMPONENT_COUNT - 1;

/**
 * Adds a ducted system's duct gains and losses to the rooms it serves: each hour the duct gain of
 * that hour's coincident sensible load (attic air and outdoor temperature of the hour) is shared
 * among the served rooms by their sensible gain that hour; the latent gain by their latent gain and
 * the heating loss by their heat loss (largest remainder, so the rooms add up to the duct figure).
 * The blower airflow is fixed for the day: entered, else 400 cfm per ton of the served rooms'
 * coincident cooling peak (their heat loss when they have no cooling load). [OWN: stated sharing rule; method in ducts.ts]
 * Returns new room work (tables updated in place) and the duct figures for each hour index.
 */
export function applyDucts(
  ducts: DuctSystem,
  work: readonly RoomHourly[],
  psy: DesignPsychrometrics,
  ctx: DesignDayContext,
  areas: readonly number[],
): { work: RoomHourly[]; byHour: DuctLoad[]; roomIds: string[] } {
  const wanted = ducts.roomIds ? new Set(ducts.roomIds) : null;
  const served: number[] = [];
  work.forEach((w, i) => {
    if (!wanted || wanted.has(w.room.id)) served.push(i);
  });
  const sum = new Float64Array(HOURS);
  let latent = 0;
  let floor = 0;
  const heat: number[] = [];
  let heating = 0;
  for (const i of served) {
    const w = work[i];
    if (!w) continue;
    for (let h = 0; h < HOURS; h += 1) sum[h] = (sum[h] ?? 0) + (w.hourly[h] ?? 0);
    latent += w.latent.total;
    floor += areas[i] ?? 0;
    const hl = roomHeating(w.room, psy, w.air, 0).total;
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
  for (let h = 0; h < HOURS; h += 1) {
    const d = ductLoadFromParsed(fixed, psy, ctx, {
      hour: h + 1,
      sensibleBtuh: sum[h] ?? 0,
      latentBtuh: latent,
      heatingBtuh: heating,
      floorAreaFt2: floor,
    });
    byHour.push(d);
    const shares = apportion(
      d.cooling.sensibleBtuh,
      served.map((i) => work[i]?.hourly[h] ?? 0),
    );
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
    let p = 0;
    for (let h = 1; h < HOURS; h += 1) if ((w.hourly[h] ?? 0) > (w.hourly[p] ?? 0)) p = h;
    const dl = latentShares[j] ?? 0;
    next[i] = {
      room: w.room,
      air: w.air,
      ctx: w.ctx,
      table: w.table,
      hourly: w.hourly,
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
        ducts: dl,
        total: w.latent.total + dl,
      },
      ductHeatingBtuh: heatShares[j] ?? 0,
    };
  });
  return { work: next, byHour, roomIds: served.map((i) => work[i]?.room.id ?? '') };
}
