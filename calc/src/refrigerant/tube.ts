import { CalcError, num } from '../errors';

/** One ASTM B280 annealed ACR tube size: actual OD and wall, in. */
export interface AcrTube {
  readonly label: string;
  readonly odIn: number;
  readonly wallIn: number;
}

/**
 * ASTM B280 ACR tube, annealed (coils), actual OD and wall thickness, in.
 * [PUB: ASTM B280 as tabulated at engineeringtoolbox.com copper-tube-astm-280; Copper Tube Handbook ACR table]
 */
export const ASTM_B280_ANNEALED: readonly AcrTube[] = [
  { label: '1/4', odIn: 0.25, wallIn: 0.03 },
  { label: '5/16', odIn: 0.312, wallIn: 0.032 },
  { label: '3/8', odIn: 0.375, wallIn: 0.032 },
  { label: '1/2', odIn: 0.5, wallIn: 0.032 },
  { label: '5/8', odIn: 0.625, wallIn: 0.035 },
  { label: '3/4', odIn: 0.75, wallIn: 0.035 },
  { label: '7/8', odIn: 0.875, wallIn: 0.045 },
];

/** Finds the B280 size for an OD (within 0.002 in, so 0.312 and 0.3125 both mean 5/16); throws UNKNOWN_TUBE_OD. */
export function acrTube({ odIn }: { readonly odIn: number }): AcrTube {
  const od = num(odIn, 'positive');
  const tube = ASTM_B280_ANNEALED.find((t) => Math.abs(t.odIn - od) < 0.002);
  if (!tube) throw new CalcError('UNKNOWN_TUBE_OD');
  return tube;
}

/** Inside diameter, in = OD − 2 × wall (ASTM B280 annealed). 3/8 → 0.311. Rounded to 0.001 in (the table's precision). */
export function tubeInsideDiameterIn({ odIn }: { readonly odIn: number }): number {
  const t = acrTube({ odIn });
  return Math.round((t.odIn - 2 * t.wallIn) * 1000) / 1000;
}

/** The B280 fraction label ("3/8") for an OD. */
export function tubeLabel({ odIn }: { readonly odIn: number }): string {
  return acrTube({ odIn }).label;
}

/** Internal volume, in³ per ft = π/4 × ID² × 12. No rounding. */
export function tubeVolumeIn3PerFt({ odIn }: { readonly odIn: number }): number {
  const id = tubeInsideDiameterIn({ odIn });
  return (Math.PI / 4) * id * id * 12;
}
