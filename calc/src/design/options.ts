import { homeLoadFromParsed } from '../loads/home-load';
import { parseOrThrow } from '../parse';
import { compareOptions } from '../pricing/price';
import { priceBookSchema, pricingSchema, type PricingInput } from '../pricing/schemas';
import { designSchema, type DesignInput } from '../schemas/design';
import { equipmentCatalogSchema } from '../schemas/equipment';
import { homeInputSchema } from '../schemas/home';
import { DEFAULT_SIZING_POLICY, sizingPolicySchema } from '../sizing/policy';
import { computeDesignFromParsed, type DesignRequest, type DesignResult } from './compute-design';

/** One proposal option: its own design and pricing on the same home, catalog and price book. */
export interface OptionRequest {
  readonly key: string;
  readonly name: string;
  readonly design: DesignInput;
  readonly pricing: PricingInput;
}

/**
 * Up to three (or more) options side by side: each option's full design result, and a
 * comparison row with its total and its difference from the first option, cents. The home,
 * catalog, price book and policy are validated once and the home's loads computed once for all
 * options (they share the home); each option's design and pricing are validated on their own.
 */
export function computeOptions({
  options,
  ...shared
}: Omit<DesignRequest, 'design' | 'pricing'> & { readonly options: readonly OptionRequest[] }): {
  results: { key: string; name: string; result: DesignResult }[];
  comparison: ReturnType<typeof compareOptions>;
} {
  const home = parseOrThrow(homeInputSchema, shared.home);
  const catalog = parseOrThrow(equipmentCatalogSchema, shared.catalog);
  const priceBook = parseOrThrow(priceBookSchema, shared.priceBook);
  const policy = parseOrThrow(sizingPolicySchema, shared.policy ?? DEFAULT_SIZING_POLICY);
  const loads = homeLoadFromParsed(home);
  const results = options.map((o) => ({
    key: o.key,
    name: o.name,
    result: computeDesignFromParsed({
      home,
      design: parseOrThrow(designSchema, o.design),
      catalog,
      priceBook,
      pricing: parseOrThrow(pricingSchema, o.pricing),
      policy,
      loads,
    }),
  }));
  return {
    results,
    comparison: compareOptions({ options: results.map((r) => ({ key: r.key, name: r.name, price: r.result.price })) }),
  };
}
