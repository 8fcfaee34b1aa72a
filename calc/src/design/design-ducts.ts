import { CalcError } from '../errors';
import { explanation, input, type Explanation } from '../explain/explanation';
import { formatNumber, formatQuantity } from '../explain/format';
import type { HomeDucts } from '../loads/home-ducts';
import { homeLoadFromParsed, type HomeLoad } from '../loads/home-load';
import { apportion } from '../loads/peak-detail';
import { roundHalfUp } from '../rounding';
import { ductedRoomIds, roomOnTwoDuctedSystems, type Design, type System } from '../schemas/design';
import type { DuctLocation } from '../schemas/ducts';
import { isDuctedUnit, type IndoorUnit } from '../schemas/equipment';
import type { Home } from '../schemas/home';

type SystemDucts = NonNullable<System['ducts']>;

/** Where the ducts run, in the words the desk and the proposal print. */
export const DUCT_LOCATION_WORDS: Record<DuctLocation, string> = {
  conditioned: 'inside the conditioned space',
  attic: 'in the attic',
  crawlspace: 'in a crawl space',
  garage: 'in the garage',
  basement: 'in an unheated basement',
};

/**
 * The home an option's loads are worked on. Each ducted system of the design carries its ducts (where they run,
 * their insulation and leakage); together they replace the walk-through's ducts for this option, each serving the
 * rooms of the zones that system's circuits reach (the schema keeps a room on one system's ducts), so a ductless
 * option of the same job has no duct loads and each ducted system has its own. A design without ducts leaves the
 * home as walked through (null: the caller's loads stand). `systemKeys[i]` is the system of the loads'
 * `ductSystems[i]`.
 */
export function homeWithDesignDucts(home: Home, design: Design): { home: Home; systemKeys: string[] } | null {
  const ducted = design.systems.flatMap((s, i) => (s.ducts ? [{ s, i, ducts: s.ducts }] : []));
  if (ducted.length === 0) return null;
  const owner = new Map<string, string>();
  const ductSystems = ducted.map(({ s, i, ducts: given }) => {
    const roomIds = ductedRoomIds(design, s);
    for (const id of roomIds) {
      const other = owner.get(id);
      if (other !== undefined)
        throw new CalcError('INVALID_INPUT', [
          { path: ['systems', i, 'ducts'], message: roomOnTwoDuctedSystems(id, other) },
        ]);
      owner.set(id, s.name);
    }
    // The test's words are for the why; the load method takes the fractions themselves.
    const { leakageTest: _words, ...ducts } = given;
    return { ...ducts, roomIds };
  });
  return {
    home: { ...home, ducts: undefined, ductSystems },
    systemKeys: ducted.map((d) => d.s.key),
  };
}

/**
 * The home an option's loads are worked on, whatever its systems: a ducted system's own ducts
 * (homeWithDesignDucts); else the walk-through's ducts on the rooms of the zones a ducted unit serves (air handler
 * or slim ducted head: `ductedZone`) that are also on the walk-through's ducts; else, no ducted unit in the option,
 * the home without ducts — no conditioned air moves through ducts no system of the option uses, so they add no
 * gain or loss (ASHRAE Standard 152 works the losses of the distribution system in use; common practice).
 * `changed` false: the walk-through's home stands as it is (the caller's shared loads may be used). `systemKey`:
 * the system whose duct loads are explained (the first ducted one; null when none is).
 */
export function homeForDesign(
  home: Home,
  design: Design,
  ductedZone: (zone: Design['zones'][number]) => boolean,
): { home: Home; systemKeys: string[]; changed: boolean } {
  const own = homeWithDesignDucts(home, design);
  if (own) return { ...own, changed: true };
  if (!home.ducts) return { home, systemKeys: [], changed: false };
  const zones = design.zones.filter(ductedZone);
  const keys = new Set(zones.map((z) => z.key));
  const system = design.systems.find((s) => s.circuits.some((c) => keys.has(c.zoneKey)));
  const systemKeys = system ? [system.key] : [];
  const onWalked = home.ducts.roomIds ? new Set(home.ducts.roomIds) : null;
  const served = [...new Set(zones.flatMap((z) => z.roomIds))].filter((id) => !onWalked || onWalked.has(id));
  if (served.length === 0) return { home: { ...home, ducts: undefined }, systemKeys: [], changed: true };
  const all = !home.ducts.roomIds && home.rooms.every((r) => served.includes(r.id));
  if (all) return { home, systemKeys, changed: false };
  return { home: { ...home, ducts: { ...home.ducts, roomIds: served } }, systemKeys, changed: true };
}

/** One system's part of the walk-through's ducts, Btu/h (whole numbers), when several ducted systems run on them. */
export interface DuctShare {
  readonly roomNames: readonly string[];
  readonly sensibleBtuh: number;
  readonly latentBtuh: number;
  readonly heatingBtuh: number;
  /** How many systems share the ducts. */
  readonly systems: number;
}

/**
 * Each system's share of the walk-through's one set of ducts, by system key, when two or more ducted systems of the
 * option run on them (none has ducts of its own); null otherwise (one system: the whole set is its own). The ducts'
 * loads are worked once for all the rooms they serve and shared among those rooms by each room's gain and loss
 * (home-ducts.ts), so a system takes its own rooms' shares: the latent gain and heat loss the load method gave
 * them, and the sensible gain at the block hour in proportion to their sensible gain that hour (largest
 * remainder, so the systems add up to the ducts' figure). A room on two systems' zones counts for the first.
 */
export function walkThroughDuctShares({
  home,
  design,
  loads,
  ductedZone,
}: {
  readonly home: Home;
  readonly design: Design;
  readonly loads: Pick<HomeLoad, 'rooms' | 'block' | 'ductSystems'>;
  readonly ductedZone: (zone: Design['zones'][number]) => boolean;
}): Map<string, DuctShare> | null {
  const d = loads.ductSystems[0];
  if (!home.ducts || !d || loads.ductSystems.length !== 1 || design.systems.some((s) => s.ducts)) return null;
  const served = new Set(d.roomIds);
  const taken = new Set<string>();
  const bySystem = design.systems.flatMap((s) => {
    const reached = new Set(s.circuits.map((c) => c.zoneKey));
    const ids = design.zones
      .filter((z) => reached.has(z.key) && ductedZone(z))
      .flatMap((z) => z.roomIds)
      .filter((id) => served.has(id) && !taken.has(id));
    for (const id of ids) taken.add(id);
    return ids.length > 0 ? [{ key: s.key, ids: [...new Set(ids)] }] : [];
  });
  if (bySystem.length < 2) return null;
  const rooms = new Map(loads.rooms.map((r) => [r.roomId, r]));
  const at = loads.block.hour - 1;
  const sum = (ids: readonly string[], f: (r: HomeLoad['rooms'][number]) => number) =>
    ids.reduce((t, id) => {
      const r = rooms.get(id);
      return t + (r ? f(r) : 0);
    }, 0);
  // Rooms on the ducts that no system's zone reaches keep their part of the sensible gain (it is theirs).
  const rest = [...served].filter((id) => !taken.has(id));
  const sensible = apportion(
    roundHalfUp(d.cooling.sensibleBtuh),
    [...bySystem.map((s) => s.ids), rest].map((ids) =>
      Math.max(
        0,
        sum(ids, (r) => r.hourlySensibleBtuh[at] ?? 0),
      ),
    ),
  );
  return new Map(
    bySystem.map((s, i) => [
      s.key,
      {
        roomNames: s.ids.map((id) => rooms.get(id)?.roomName ?? id),
        sensibleBtuh: sensible[i] ?? 0,
        latentBtuh: sum(s.ids, (r) => r.latentGain.ducts),
        heatingBtuh: sum(s.ids, (r) => r.heatLoss.ducts),
        systems: bySystem.length,
      },
    ]),
  );
}

/**
 * The loads an option is sized on — the one path from a design to its loads, for the desk (computeDesign) and for
 * suggest, which judges each candidate plan on the loads the desk will show for it: the home of homeForDesign, a zone
 * counting as ducted when its indoor unit is (an air handler or slim ducted head, `isDuctedUnit`). `loads`: the
 * walk-through home's loads when the caller has them (used when the design leaves the home as walked); `loadsOf`: how
 * to work a changed home's loads (a caller trying many designs on one home keeps them; default homeLoadFromParsed).
 */
export function designLoads({
  home,
  design,
  indoorUnits,
  loads,
  loadsOf = homeLoadFromParsed,
}: {
  readonly home: Home;
  readonly design: Design;
  readonly indoorUnits: ReadonlyMap<string, IndoorUnit>;
  readonly loads?: HomeLoad;
  readonly loadsOf?: (home: Home) => HomeLoad;
}): {
  readonly loads: HomeLoad;
  readonly systemKeys: readonly string[];
  readonly ductedZone: (zone: Design['zones'][number]) => boolean;
} {
  const ductedZone = (z: Design['zones'][number]) => {
    const u = indoorUnits.get(z.indoorUnitKey);
    return u !== undefined && isDuctedUnit(u);
  };
  const withDucts = homeForDesign(home, design, ductedZone);
  const worked = withDucts.changed ? withDucts.home : home;
  return {
    loads: withDucts.changed || !loads ? loadsOf(worked) : loads,
    systemKeys: withDucts.systemKeys,
    ductedZone,
  };
}

/**
 * The walk-through's ducts in a system's words (where they run, insulation, tightness; tested fractions with the
 * note that they were entered on the walk-through), for a ducted system that sets none of its own. Undefined: the
 * home has no ducts.
 */
export function walkThroughDucts(home: Home): SystemDucts | undefined {
  const d = home.ducts;
  if (!d) return undefined;
  const tested = d.supplyLeakageFraction !== undefined || d.returnLeakageFraction !== undefined;
  return {
    location: d.location,
    insulationR: d.insulationR,
    leakage: d.leakage,
    ...(d.supplyLeakageFraction === undefined ? {} : { supplyLeakageFraction: d.supplyLeakageFraction }),
    ...(d.returnLeakageFraction === undefined ? {} : { returnLeakageFraction: d.returnLeakageFraction }),
    ...(tested ? { leakageTest: WALK_THROUGH_TEST } : {}),
  };
}

/** The test note of leakage fractions taken from the walk-through (which records the fractions, not the test). */
export const WALK_THROUGH_TEST = 'as entered on the walk-through';

const btuh = (v: number) => formatQuantity(roundHalfUp(v), 'Btu/h');

/**
 * Where the leakage fractions came from: the test (with its date and method) for each fraction entered, else
 * the tightness's defaults — "supply 0.06 and return 0.04 tested (2026-11-12, …)".
 */
function leakageWords(d: HomeDucts, given: SystemDucts | undefined): string {
  const f = (v: number) => formatNumber(v, 2);
  const fromTest = (v: number | undefined) => v !== undefined;
  const s = fromTest(given?.supplyLeakageFraction);
  const r = fromTest(given?.returnLeakageFraction);
  const defaults = `the "${given?.leakage ?? 'typical'}" defaults (common practice, from memory)`;
  if (!s && !r)
    return `leakage to outside: supply ${f(d.supplyLeakageFraction)} and return ${f(d.returnLeakageFraction)} of the airflow, ${defaults}`;
  const test = `tested (${given?.leakageTest ?? ''})`;
  const part = (label: string, v: number, tested: boolean) => `${label} ${f(v)} ${tested ? test : `from ${defaults}`}`;
  return `leakage to outside: ${part('supply', d.supplyLeakageFraction, s)}; ${part('return', d.returnLeakageFraction, r)}`;
}

/**
 * The duct loads of a ducted system as the desk shows them, from the load method's figures at the block hour; with
 * `share`, the system's own rooms' part of ducts that several systems run on (walkThroughDuctShares).
 */
export function explainDuctLoads(
  systemKey: string,
  systemName: string,
  d: HomeDucts,
  given?: SystemDucts,
  share?: DuctShare,
): Explanation {
  const where = DUCT_LOCATION_WORDS[d.location];
  const shareInputs = share
    ? [
        input('Sensible gain, this system’s rooms', share.sensibleBtuh, 'Btu/h', btuh(share.sensibleBtuh)),
        input('Latent gain, this system’s rooms', share.latentBtuh, 'Btu/h', btuh(share.latentBtuh)),
        input('Heat loss, this system’s rooms', share.heatingBtuh, 'Btu/h', btuh(share.heatingBtuh)),
      ]
    : [];
  const shareText = share
    ? `${systemName}: ${share.roomNames.join(', ')} — ${btuh(share.sensibleBtuh)} sensible and ` +
      `${btuh(share.latentBtuh)} latent gain of the ducts’ ${btuh(d.cooling.sensibleBtuh)} and ` +
      `${btuh(d.cooling.latentBtuh)} at the block hour, and ${btuh(share.heatingBtuh)} of their ` +
      `${btuh(d.heating.btuh)} heat loss: the walk-through’s ducts serve the rooms of ${share.systems} systems, ` +
      'so their loads are worked once for all those rooms and each room takes its part by its own gain and loss. '
    : '';
  return explanation({
    key: `${systemKey}:ducts`,
    label: `Duct loads, ${systemName} (ducts ${where}, R-${formatNumber(d.insulationR, 1, { trim: true })})`,
    value: share ? share.sensibleBtuh : roundHalfUp(d.cooling.sensibleBtuh),
    unit: 'Btu/h',
    valueText: btuh(share ? share.sensibleBtuh : d.cooling.sensibleBtuh),
    text:
      shareText +
      `Ducts ${where} at ${formatNumber(d.cooling.surroundingsF)} °F around them: ` +
      `${btuh(d.cooling.sensibleBtuh)} sensible and ${btuh(d.cooling.latentBtuh)} latent gain at the block hour ` +
      `(delivery effectiveness ${formatNumber(d.cooling.deliveryEffectiveness, 2)}); ` +
      `${btuh(d.heating.btuh)} heat loss at ${formatNumber(d.heating.surroundingsF)} °F ` +
      `(delivery effectiveness ${formatNumber(d.heating.deliveryEffectiveness, 2)}); ` +
      `${leakageWords(d, given)}; ` +
      `the R-${formatNumber(d.insulationR, 1, { trim: true })} insulation works as R-${formatNumber(d.supplyEffectiveR, 2, { trim: true })} on the supply and ` +
      `R-${formatNumber(d.returnEffectiveR, 2, { trim: true })} on the return (measured round flex duct with its air films, Palmiter and Kruse 2006). ` +
      'Added to the rooms these ducts serve, so the sizing above includes them.',
    inputs: [
      ...shareInputs,
      input('Insulation', d.insulationR, 'R', `R-${formatNumber(d.insulationR, 1, { trim: true })}`),
      input(
        'Working R, supply (round flex, 6 in)',
        d.supplyEffectiveR,
        'R',
        `R-${formatNumber(d.supplyEffectiveR, 2, { trim: true })}`,
      ),
      input(
        'Working R, return (round flex, 14 in)',
        d.returnEffectiveR,
        'R',
        `R-${formatNumber(d.returnEffectiveR, 2, { trim: true })}`,
      ),
      input('Blower airflow', d.airflowCfm, 'cfm', formatQuantity(roundHalfUp(d.airflowCfm), 'cfm')),
      input('Supply leakage', d.supplyLeakageFraction, '', formatNumber(d.supplyLeakageFraction, 2)),
      input('Return leakage', d.returnLeakageFraction, '', formatNumber(d.returnLeakageFraction, 2)),
    ],
    status: 'note',
    source: d.source,
  });
}
