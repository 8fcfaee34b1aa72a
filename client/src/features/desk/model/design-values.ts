import { designSchema, type DesignInput } from '@calc';
import type { OptionRecord, RoomRecord } from '@contract';
import type { DeskModel } from '../api/get-models';

/** The option's stored design as the form edits it, or a first zone and system to fill in. */
export function designValues(option: OptionRecord): DesignInput {
  const stored = designSchema.safeParse(option.design);
  // Every field the form shows is a key of the values, even when absent (undefined): the form compares its
  // values with these whole, and a field that appears on screen would otherwise make a just-saved design look
  // changed. A circuit's lift direction absent means above (calc's rule) and is shown so.
  if (stored.success)
    return {
      ...stored.data,
      zones: stored.data.zones.map((z) => ({
        ...z,
        headRoomId: z.headRoomId,
        openSpace: z.openSpace,
        lowestDuctOpeningFt: z.lowestDuctOpeningFt,
      })),
      systems: stored.data.systems.map((s) => ({
        ...s,
        ducts: s.ducts && {
          ...s.ducts,
          supplyLeakageFraction: s.ducts.supplyLeakageFraction,
          returnLeakageFraction: s.ducts.returnLeakageFraction,
          leakageTest: s.ducts.leakageTest,
        },
        heatKitKey: s.heatKitKey,
        electrical: {
          ...s.electrical,
          heatKitDisconnectDistanceFt: s.electrical.heatKitDisconnectDistanceFt,
          heatKitCircuitLengthFt: s.electrical.heatKitCircuitLengthFt,
        },
        circuits: s.circuits.map((c) => ({ ...c, liftDirection: c.liftDirection ?? 'indoor-above' })),
      })),
    };
  return {
    zones: [{ key: 'zone-1', name: 'Zone 1', roomIds: [], indoorUnitKey: '' }],
    systems: [
      {
        key: 'sys-1',
        name: 'Outdoor unit 1',
        outdoorUnitKey: '',
        circuits: [{ zoneKey: 'zone-1', lengthFt: Number.NaN, liftFt: 0, liftDirection: 'indoor-above' }],
        electrical: { circuitLengthFt: Number.NaN, disconnectDistanceFt: 5 },
      },
    ],
  };
}

/** A key not used yet among `used`: zone-2, zone-3, … */
export function nextKey(prefix: string, used: readonly string[]): string {
  for (let n = 1; ; n++) if (!used.includes(`${prefix}-${n}`)) return `${prefix}-${n}`;
}

export const roomName = (r: RoomRecord): string =>
  typeof r.input.name === 'string' && r.input.name.trim() !== '' ? r.input.name : `Room ${r.position + 1}`;

export const modelOptions = (models: readonly DeskModel[], outdoor: boolean) => [
  { value: '', label: outdoor ? 'Choose an outdoor unit' : 'Choose an indoor unit' },
  ...models
    .filter((m) => (outdoor ? m.kind.startsWith('outdoor') : m.kind === 'indoor'))
    .map((m) => ({ value: m.key, label: `${m.key} — ${m.name}` })),
];

/** Indoor units whose air goes through ducts (their system may carry ducts and a heat kit). */
export const DUCTED_INDOOR_TYPES: readonly string[] = ['slim-ducted', 'air-handler'];

/**
 * The heat kits for a system with an air handler: those listed for it or for the system's outdoor unit (a kit listing
 * none fits any), and the one already chosen even when it does not fit, so the server's refusal shows beside it.
 */
export const heatKitOptions = (
  models: readonly DeskModel[],
  airHandlerKeys: readonly string[],
  outdoorKey: string,
  chosen?: string,
) => [
  { value: '', label: 'No heat kit' },
  ...models
    .filter(
      (m) =>
        m.kind === 'heat-kit' &&
        (m.key === chosen ||
          (airHandlerKeys.length > 0 &&
            (m.matchedKeys.length === 0 ||
              m.matchedKeys.includes(outdoorKey) ||
              m.matchedKeys.some((k) => airHandlerKeys.includes(k))))),
    )
    .map((m) => ({
      value: m.key,
      label: `${m.key} — ${m.name}${m.heatKitKw === null ? '' : ` (${m.heatKitKw} kW)`}`,
    })),
];
