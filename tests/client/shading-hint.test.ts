import { describe, expect, it } from 'vitest';
import { shadingHint } from '../../client/src/features/walkthrough/model/options';

// The hint under "Interior shading" in the walk-through's window fields: what the chosen shade lets through that
// glass, by calc's IAC line (ASHRAE 2021 ch. 15 Table 14 as OpenStudio-HPXML fits it), and the standing of its
// radiant part. Worked by hand from the source's rows: over double clear glass (SHGC 0.67) blinds 0.95 − 0.26 × 0.67
// = 0.776 → 78 %; drapes 0.94 − 0.37 × 0.67 = 0.692 → 69 %; over SHGC 0.30 low-e shades 0.98 − 0.33 × 0.30 = 0.881 → 88 %.
describe('shadingHint', () => {
  it('says how much sun the chosen shade lets through this glass, and which row of the table it is', () => {
    expect(shadingHint('blinds', 0.67)).toBe('Lets 78 % of the sun in (ASHRAE ch. 15, medium blinds half open).');
    expect(shadingHint('drapes', 0.67)).toMatch(/^Lets 69 % .*medium curtains/);
    expect(shadingHint('shades', 0.3)).toMatch(/^Lets 88 % .*dark shades/);
  });
  it('says the drapes’ radiant part is from memory (the blinds’ and shades’ are published rows)', () => {
    expect(shadingHint('drapes', 0.67)).toMatch(/Its delay figure is from memory\.$/);
    expect(shadingHint('blinds', 0.67)).not.toMatch(/from memory/);
    expect(shadingHint('shades', 0.67)).not.toMatch(/from memory/);
  });
  it('with no shade, or no SHGC yet, says what to pick', () => {
    expect(shadingHint('none', 0.67)).toBe('The shade drawn on a hot afternoon.');
    expect(shadingHint('blinds', undefined)).toMatch(/hot afternoon/);
  });
});
