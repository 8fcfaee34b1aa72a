import { designSchema, type DesignInput } from '@calc';

/**
 * An option's design as calc reads it: calc's schema output, every default filled in (a circuit's 10 ft
 * condensate line, one wall penetration, a gravity drain, …), or the design as stored when it does not
 * parse (calc then reports why, and the estimator sees what was saved).
 *
 * A design is stored from several places: the desk's PATCH (its body parsed by this schema, so defaults
 * filled), the suggestion and the first price (calc's own input, defaults absent), a copy of another option,
 * the demo fixtures. Worked out, both forms give the same figures (desk-compute parses before calc), but a
 * reader of the raw JSON saw a default as absent: the proposal's snapshot printed an absent condensate run as
 * 0 ft while the takeoff charged 10 ft of line, and the desk's GET returned the design without its defaults,
 * so saving it back as returned (the form parses it) changed the stored design and the next version's
 * snapshot (0 → 10 ft). Every reader and writer of a stored design goes through here, so GET → PATCH as
 * returned → GET changes nothing. Pure and idempotent: `designAsCalcReadsIt(designAsCalcReadsIt(d))` deep-equals
 * `designAsCalcReadsIt(d)` (tests/server/desk-round-trip.test.ts).
 */
export function designAsCalcReadsIt(design: DesignInput): DesignInput {
  const parsed = designSchema.safeParse(design);
  return parsed.success ? parsed.data : design;
}
