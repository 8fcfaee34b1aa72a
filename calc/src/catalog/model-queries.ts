import { capacityAtOutdoorF, type CapacityAt } from '../sizing/capacity';
import type { CatalogModel } from './model';

/**
 * Capacity of a catalog model at a design outdoor temperature, Btu/h, interpolated linearly
 * between its rating points (held at the nearest point outside them, flagged); null when the
 * model lists no point for that mode.
 */
export function modelCapacityAt({
  model,
  mode,
  outdoorF,
}: {
  readonly model: Pick<CatalogModel, 'coolingPoints' | 'heatingPoints'>;
  readonly mode: 'cooling' | 'heating';
  readonly outdoorF: number;
}): CapacityAt | null {
  const points = mode === 'cooling' ? model.coolingPoints : model.heatingPoints;
  return points.length === 0 ? null : capacityAtOutdoorF({ points, outdoorF });
}

/** The maker's charge adder for a liquid-line size, oz/ft; null when the maker gives none for that size. */
export function chargeAdderOzPerFt({
  model,
  liquidOdIn,
}: {
  readonly model: Pick<CatalogModel, 'chargeAdders'>;
  readonly liquidOdIn: number;
}): number | null {
  return model.chargeAdders.find((a) => a.liquidOdIn === liquidOdIn)?.ozPerFt ?? null;
}
