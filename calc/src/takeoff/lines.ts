import { roundHalfUp } from '../rounding';

/** One takeoff line: what, how many, in which unit, and how the quantity was derived. */
export interface TakeoffLine {
  readonly itemKey: string;
  readonly description: string;
  readonly quantity: number;
  readonly unit: 'each' | 'ft' | 'h' | 'cylinder' | 'roll' | 'lb' | 'oz';
  readonly category: 'equipment' | 'material' | 'labor';
  readonly derivation: string;
}

/** Merges lines with the same item key (each key has one unit; quantities add, rounded half-up to 0.01; derivations join with "; "). Keeps first-seen order. */
export function mergeLines(lines: readonly TakeoffLine[]): TakeoffLine[] {
  const groups = new Map<string, { first: TakeoffLine; quantity: number; derivations: string[] }>();
  for (const line of lines) {
    const id = line.itemKey;
    const g = groups.get(id);
    if (g) {
      g.quantity += line.quantity;
      g.derivations.push(line.derivation);
    } else {
      groups.set(id, { first: line, quantity: line.quantity, derivations: [line.derivation] });
    }
  }
  const out: TakeoffLine[] = [];
  for (const { first: l, quantity, derivations } of groups.values()) {
    out.push({
      itemKey: l.itemKey,
      description: l.description,
      quantity: derivations.length > 1 ? roundHalfUp(quantity, 2) : quantity,
      unit: l.unit,
      category: l.category,
      derivation: derivations.length > 1 ? derivations.join('; ') : l.derivation,
    });
  }
  return out;
}
