import { CalcError } from '../errors';
import { explanation, input, type Explanation } from '../explain/explanation';
import { formatNumber, formatQuantity } from '../explain/format';
import type { HomeDucts } from '../loads/home-ducts';
import { roundHalfUp } from '../rounding';
import { ONE_DUCTED_SYSTEM, type Design, type System } from '../schemas/design';
import type { DuctLocation } from '../schemas/ducts';
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
 * The home an option's loads are worked on. A ducted system of the design carries its ducts (where they run,
 * their insulation and leakage); they replace the walk-through's ducts for this option and serve the rooms of
 * the zones the system's circuits reach, so a ductless option of the same job has no duct loads and a ducted
 * one has its own. A design without ducts leaves the home as walked through (null: the caller's loads stand).
 * One ducted system per option: the load method carries one set of ducts (calc/src/loads/home-ducts.ts).
 */
export function homeWithDesignDucts(home: Home, design: Design): { home: Home; systemKey: string } | null {
  const ducted = design.systems.flatMap((s, i) => (s.ducts ? [{ s, i, ducts: s.ducts }] : []));
  const [first, second] = ducted;
  if (!first) return null;
  if (second)
    throw new CalcError('INVALID_INPUT', [
      {
        path: ['systems', second.i, 'ducts'],
        message: ONE_DUCTED_SYSTEM,
      },
    ]);
  const zones = new Set(first.s.circuits.map((c) => c.zoneKey));
  const roomIds = [...new Set(design.zones.filter((z) => zones.has(z.key)).flatMap((z) => z.roomIds))];
  // The test's words are for the why; the load method takes the fractions themselves.
  const { leakageTest: _words, ...ducts } = first.ducts;
  return { home: { ...home, ducts: { ...ducts, roomIds } }, systemKey: first.s.key };
}

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

/** The duct loads of a ducted system as the desk shows them, from the load method's figures at the block hour. */
export function explainDuctLoads(
  systemKey: string,
  systemName: string,
  d: HomeDucts,
  given?: SystemDucts,
): Explanation {
  const where = DUCT_LOCATION_WORDS[d.location];
  return explanation({
    key: `${systemKey}:ducts`,
    label: `Duct loads, ${systemName} (ducts ${where}, R-${formatNumber(d.insulationR, 1, { trim: true })})`,
    value: roundHalfUp(d.cooling.sensibleBtuh),
    unit: 'Btu/h',
    valueText: btuh(d.cooling.sensibleBtuh),
    text:
      `Ducts ${where} at ${formatNumber(d.cooling.surroundingsF)} °F around them: ` +
      `${btuh(d.cooling.sensibleBtuh)} sensible and ${btuh(d.cooling.latentBtuh)} latent gain at the block hour ` +
      `(delivery effectiveness ${formatNumber(d.cooling.deliveryEffectiveness, 2)}); ` +
      `${btuh(d.heating.btuh)} heat loss at ${formatNumber(d.heating.surroundingsF)} °F ` +
      `(delivery effectiveness ${formatNumber(d.heating.deliveryEffectiveness, 2)}); ` +
      `${leakageWords(d, given)}. ` +
      'Added to the rooms these ducts serve, so the sizing above includes them.',
    inputs: [
      input('Insulation', d.insulationR, 'R', `R-${formatNumber(d.insulationR, 1, { trim: true })}`),
      input('Blower airflow', d.airflowCfm, 'cfm', formatQuantity(roundHalfUp(d.airflowCfm), 'cfm')),
      input('Supply leakage', d.supplyLeakageFraction, '', formatNumber(d.supplyLeakageFraction, 2)),
      input('Return leakage', d.returnLeakageFraction, '', formatNumber(d.returnLeakageFraction, 2)),
    ],
    status: 'note',
    source: d.source,
  });
}
