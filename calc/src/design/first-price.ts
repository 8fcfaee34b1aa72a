import type { CatalogModel } from '../catalog/model';
import { preliminaryPriceRange, type PreliminaryRange } from '../pricing/preliminary';
import type { PriceBookInput, PricingInput } from '../pricing/schemas';
import type { DesignInput } from '../schemas/design';
import type { HomeInput } from '../schemas/home';
import type { SizingPolicy } from '../sizing/policy';
import { designCatalogFromModels } from '../catalog/design-bridge';
import { computeDesign, type DesignResult } from './compute-design';
import { suggestDesign, type Suggestion } from './suggest';

/** Runs assumed for the range, ft: a short one-wall run and a long one. [TRADE: common mini-split runs] */
export const FIRST_PRICE_RUNS_FT = { short: 15, long: 50 } as const;

export interface FirstPrice {
  readonly suggestion: Suggestion;
  /** The suggestion priced at the default run (what the option is saved with). */
  readonly result: DesignResult;
  readonly range: PreliminaryRange;
}

function withRuns(design: DesignInput, lengthFt: number): DesignInput {
  return {
    ...design,
    systems: design.systems.map((s) => ({ ...s, circuits: s.circuits.map((c) => ({ ...c, lengthFt })) })),
  };
}

/**
 * "A first price before leaving" (issue 13): suggest equipment from the active catalog, price it from
 * the price book, and give a range rather than a figure — the suggestion priced with every run at
 * FIRST_PRICE_RUNS_FT.short and at .long (the walk-through measures no runs), widened by the
 * PRELIMINARY_BAND and rounded outward to $100. Marked preliminary everywhere; the caller must not
 * send it as a proposal until an estimator or owner has reviewed it.
 */
export function firstPrice({
  home,
  models,
  priceBook,
  pricing,
  policy,
}: {
  readonly home: HomeInput;
  readonly models: readonly CatalogModel[];
  readonly priceBook: PriceBookInput;
  readonly pricing: PricingInput;
  readonly policy?: SizingPolicy;
}): FirstPrice {
  const suggestion = suggestDesign(policy ? { home, models, policy } : { home, models });
  const catalog = designCatalogFromModels(models);
  const run = (design: DesignInput) =>
    computeDesign(
      policy ? { home, design, catalog, priceBook, pricing, policy } : { home, design, catalog, priceBook, pricing },
    );
  const result = run(suggestion.design);
  const low = run(withRuns(suggestion.design, FIRST_PRICE_RUNS_FT.short)).price.totalCents;
  const high = run(withRuns(suggestion.design, FIRST_PRICE_RUNS_FT.long)).price.totalCents;
  return { suggestion, result, range: preliminaryPriceRange({ lowTotalCents: low, highTotalCents: high }) };
}
