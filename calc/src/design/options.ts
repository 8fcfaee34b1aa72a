import { compareOptions } from '../pricing/price';
import type { PricingInput } from '../pricing/schemas';
import type { DesignInput } from '../schemas/design';
import { computeDesign, type DesignRequest, type DesignResult } from './compute-design';

/** One proposal option: its own design and pricing on the same home, catalog and price book. */
export interface OptionRequest {
  readonly key: string;
  readonly name: string;
  readonly design: DesignInput;
  readonly pricing: PricingInput;
}

/**
 * Up to three (or more) options side by side: each option's full design result, and a
 * comparison row with its total and its difference from the first option, cents.
 */
export function computeOptions({
  options,
  ...shared
}: Omit<DesignRequest, 'design' | 'pricing'> & { readonly options: readonly OptionRequest[] }): {
  results: { key: string; name: string; result: DesignResult }[];
  comparison: ReturnType<typeof compareOptions>;
} {
  const results = options.map((o) => ({
    key: o.key,
    name: o.name,
    result: computeDesign({ ...shared, design: o.design, pricing: o.pricing }),
  }));
  return {
    results,
    comparison: compareOptions({ options: results.map((r) => ({ key: r.key, name: r.name, price: r.result.price })) }),
  };
}
