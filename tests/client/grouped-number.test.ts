import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { groupedNumber } from '../../client/src/lib/grouped-number';

// The reference is the browser's own formatter, which the figures used before (issue 11 moved them off it
// for speed): every value must read exactly as Intl.NumberFormat('en-US') writes it.
const intl = new Intl.NumberFormat('en-US');

describe('groupedNumber writes a number as Intl.NumberFormat("en-US") does', () => {
  it('on the edges: zero and its sign, thousands, halves, long decimals, exponents, non-finite', () => {
    const edges = [
      0,
      -0,
      1,
      -1,
      999,
      1000,
      -1000,
      12756,
      999_999,
      1_000_000,
      1234567.891,
      0.0005,
      -0.0005,
      0.0625,
      -0.0001,
      1.0005,
      2.9995,
      999.9995,
      0.1 + 0.2,
      1e-7,
      -1e-7,
      1e20,
      2 ** 66,
      1e21,
      -1e21,
      Number.MAX_SAFE_INTEGER,
      Number.MAX_VALUE,
      Number.MIN_VALUE,
      Number.NaN,
      Infinity,
      -Infinity,
    ];
    for (const v of edges) expect(groupedNumber(v), String(v)).toBe(intl.format(v));
  });

  it('on any double', () => {
    fc.assert(
      fc.property(fc.double(), (v) => groupedNumber(v) === intl.format(v)),
      { numRuns: 20_000 },
    );
  });

  it('on whole numbers and short decimals, as the load figures are', () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.integer({ min: 0, max: 6 }), (i, d) => {
        const v = i / 10 ** d;
        return groupedNumber(v) === intl.format(v);
      }),
      { numRuns: 20_000 },
    );
  });
});
