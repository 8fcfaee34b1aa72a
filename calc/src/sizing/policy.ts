import { z } from 'zod';
import { bounded } from '../schemas/fields';
import type { EquipmentType } from '../schemas/equipment';

const range = (label: string) =>
  z.object({
    minPercent: bounded(`${label} minimum`, 50, 150, '%'),
    maxPercent: bounded(`${label} maximum`, 80, 200, '%'),
  });

/**
 * Allowed cooling capacity as % of the total cooling load per equipment type — company
 * policy, editable. Defaults: single-speed 90–115 %, two-stage 90–120 %, variable 90–130 %
 * [MEM: ACCA Manual S 2nd ed. Table N2, verify]; single-speed heat pump up to 125 %
 * [PUB (secondary): excessair blog summary of Manual S limits].
 */
export const sizingPolicySchema = z.object({
  cooling: z.object({
    'ac-single-speed': range('Single-speed AC'),
    'ac-two-stage': range('Two-stage AC'),
    'ac-variable-speed': range('Variable-speed AC'),
    'heat-pump-single-speed': range('Single-speed heat pump'),
    'heat-pump-two-stage': range('Two-stage heat pump'),
    'heat-pump-variable-speed': range('Variable-speed heat pump'),
  }),
  /** Minimum heat-pump heating capacity at the heating design temperature, % of heat loss, before a supplemental-heat warning. */
  heatingMinPercent: bounded('Heating coverage', 0, 200, '%'),
});

export type SizingPolicy = z.output<typeof sizingPolicySchema>;

export const DEFAULT_SIZING_POLICY: SizingPolicy = {
  cooling: {
    'ac-single-speed': { minPercent: 90, maxPercent: 115 },
    'ac-two-stage': { minPercent: 90, maxPercent: 120 },
    'ac-variable-speed': { minPercent: 90, maxPercent: 130 },
    'heat-pump-single-speed': { minPercent: 90, maxPercent: 125 },
    'heat-pump-two-stage': { minPercent: 90, maxPercent: 125 },
    'heat-pump-variable-speed': { minPercent: 90, maxPercent: 130 },
  },
  heatingMinPercent: 100,
};

/** True for heat pumps (their heating capacity is checked against the heat loss). */
export function isHeatPump(t: EquipmentType): boolean {
  return t.startsWith('heat-pump');
}
