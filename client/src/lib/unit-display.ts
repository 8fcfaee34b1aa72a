import {
  cFromF,
  fDeltaFromKelvin,
  fFromC,
  ft2FromM2,
  ftFromM,
  inFromCm,
  kelvinDeltaFromF,
  m2FromFt2,
  mFromFt,
  roundHalfUp,
} from '@calc';
import type { UnitSystem } from '@contract';

/**
 * Every number is stored and computed in calc's canonical imperial units; a metric company
 * sees and types metric. Conversion happens only here, at the field's edge, with calc's
 * unit helpers. Each quantity says its two unit labels and its display precision.
 */
export type Quantity = 'ft' | 'in' | 'ft2' | 'degF' | 'deltaF' | 'elevation' | 'plain';

interface Conversion {
  readonly imperial: string;
  readonly metric: string;
  readonly toMetric: (v: number) => number;
  readonly fromMetric: (v: number) => number;
  readonly metricDecimals: number;
}

const CM_PER_IN = 1 / inFromCm({ cm: 1 });

const conversions: Record<Exclude<Quantity, 'plain'>, Conversion> = {
  ft: {
    imperial: 'ft',
    metric: 'm',
    toMetric: (ft) => mFromFt({ ft }),
    fromMetric: (m) => ftFromM({ m }),
    metricDecimals: 2,
  },
  elevation: {
    imperial: 'ft',
    metric: 'm',
    toMetric: (ft) => mFromFt({ ft }),
    fromMetric: (m) => ftFromM({ m }),
    metricDecimals: 0,
  },
  in: {
    imperial: 'in',
    metric: 'cm',
    toMetric: (v) => v * CM_PER_IN,
    fromMetric: (cm) => inFromCm({ cm }),
    metricDecimals: 1,
  },
  ft2: {
    imperial: 'ft²',
    metric: 'm²',
    toMetric: (ft2) => m2FromFt2({ ft2 }),
    fromMetric: (m2) => ft2FromM2({ m2 }),
    metricDecimals: 2,
  },
  degF: {
    imperial: '°F',
    metric: '°C',
    toMetric: (f) => cFromF({ f }),
    fromMetric: (c) => fFromC({ c }),
    metricDecimals: 1,
  },
  deltaF: {
    imperial: '°F',
    metric: 'K',
    toMetric: (deltaF) => kelvinDeltaFromF({ deltaF }),
    fromMetric: (deltaK) => fDeltaFromKelvin({ deltaK }),
    metricDecimals: 1,
  },
};

export function unitLabel(q: Quantity, system: UnitSystem, plainUnit = ''): string {
  if (q === 'plain') return plainUnit;
  return system === 'metric' ? conversions[q].metric : conversions[q].imperial;
}

/** Canonical value → the number shown in the field. */
export function toDisplay(q: Quantity, system: UnitSystem, value: number): number {
  if (q === 'plain' || system === 'imperial') return value;
  const c = conversions[q];
  return roundHalfUp(c.toMetric(value), c.metricDecimals);
}

/** The number typed in the field → canonical value. */
export function fromDisplay(q: Quantity, system: UnitSystem, value: number): number {
  if (q === 'plain' || system === 'imperial') return value;
  return conversions[q].fromMetric(value);
}

/**
 * calc's bound messages are written once, in canonical units ("Length must be between 1 and
 * 200 ft", see calc/src/schemas/fields.ts `bounded`). A metric company reads them in its own
 * units: both bounds are converted and rounded as the field's value is shown. Any other message
 * passes through unchanged.
 */
export function localiseBound(message: string | undefined, q: Quantity, system: UnitSystem): string | undefined {
  if (message === undefined || q === 'plain' || system === 'imperial') return message;
  const c = conversions[q];
  const m = /^(.*) must be between (-?\d+(?:\.\d+)?) and (-?\d+(?:\.\d+)?) (\S+)$/.exec(message);
  if (!m || m[4] !== c.imperial) return message;
  const [, label, lo, hi] = m;
  return `${label} must be between ${toDisplay(q, system, Number(lo))} and ${toDisplay(q, system, Number(hi))} ${c.metric}`;
}
