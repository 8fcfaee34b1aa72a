import { INFILTRATION_TIGHTNESS } from '../construction-defaults';
import { parseOrThrow } from '../parse';
import { roundHalfUp } from '../rounding';
import { homeInputSchema, type Home, type HomeInput } from '../schemas/home';
import { BTUH_PER_TON } from '../units';
import { designPsychrometrics, type DesignPsychrometrics } from './conditions';
import { METHOD_NOTES } from './notes';
import { roomLoadFromParsed, type LoadComponents, type RoomLoad } from './room-load';

/** Whole-home estimated loads. */
export interface HomeLoad {
  readonly rooms: readonly RoomLoad[];
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
  readonly psychrometrics: {
    readonly pressurePsia: number;
    readonly altitudeFactor: number;
    readonly indoorGrains: number;
    readonly outdoorGrains: number;
    readonly deltaGrains: number;
    readonly indoorDewPointF: number;
  };
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
    people = 0,
    appliances = 0,
    total = 0;
  for (const c of sets) {
    walls += c.walls;
    windowsConduction += c.windowsConduction;
    windowsSolar += c.windowsSolar;
    doors += c.doors;
    ceiling += c.ceiling;
    floor += c.floor;
    infiltration += c.infiltration;
    people += c.people;
    appliances += c.appliances;
    total += c.total;
  }
  return { walls, windowsConduction, windowsSolar, doors, ceiling, floor, infiltration, people, appliances, total };
}

/** Whole-home loads from a parsed home (engine path; no validation). */
export function homeLoadFromParsed(
  home: Home,
  psy: DesignPsychrometrics = designPsychrometrics(home.designConditions),
): HomeLoad {
  const ach = INFILTRATION_TIGHTNESS[home.tightness].value;
  const rooms = home.rooms.map((r) => roomLoadFromParsed(r, psy, ach));
  const sensibleGain = sumComponents(rooms.map((r) => r.sensibleGain));
  const latentGain = sumComponents(rooms.map((r) => r.latentGain));
  const heatLoss = sumComponents(rooms.map((r) => r.heatLoss));
  const cooling = sensibleGain.total + latentGain.total;
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
    psychrometrics: {
      pressurePsia: roundHalfUp(psy.pressurePsia, 3),
      altitudeFactor: roundHalfUp(psy.altitudeFactor, 4),
      indoorGrains: roundHalfUp(psy.indoorGrains, 2),
      outdoorGrains: roundHalfUp(psy.outdoorGrains, 2),
      deltaGrains: roundHalfUp(psy.deltaGrains, 2),
      indoorDewPointF: roundHalfUp(psy.indoorDewPointF, 2),
    },
    notes: METHOD_NOTES,
    isEstimate: true,
  };
}

/**
 * Whole-home sensible/latent heat gain and heat loss, Btu/h, with per-room and per-
 * component breakdowns, sensible heat ratio and tons. Validates the home (CalcError
 * INVALID_INPUT with field paths). Rounding: components to 1 Btu/h, totals are sums.
 */
export function homeLoad({ home }: { readonly home: HomeInput }): HomeLoad {
  return homeLoadFromParsed(parseOrThrow(homeInputSchema, home));
}
