import { describe, expect, it } from 'vitest';
import { localiseBound } from '../../client/src/lib/unit-display';

describe('bound messages in the company’s units', () => {
  it('converts both bounds and the unit for a metric company', () => {
    // 1 ft = 0.3048 m exactly (international foot, 1959): 1 ft → 0.30 m, 200 ft → 60.96 m, shown to 2 decimals.
    expect(localiseBound('Length must be between 1 and 200 ft', 'ft', 'metric')).toBe(
      'Length must be between 0.3 and 60.96 m',
    );
    // °C = (°F − 32) × 5/9: 50 °F → 10 °C, 130 °F → 54.4 °C at 1 decimal.
    expect(localiseBound('Outdoor cooling dry bulb must be between 50 and 130 °F', 'degF', 'metric')).toBe(
      'Outdoor cooling dry bulb must be between 10 and 54.4 °C',
    );
    // 1 in = 2.54 cm exactly: 6 in → 15.2 cm, 240 in → 609.6 cm.
    expect(localiseBound('Window width must be between 6 and 240 in', 'in', 'metric')).toBe(
      'Window width must be between 15.2 and 609.6 cm',
    );
  });

  it('leaves imperial, plain numbers, other messages and a unit that does not match alone', () => {
    expect(localiseBound('Length must be between 1 and 200 ft', 'ft', 'imperial')).toBe(
      'Length must be between 1 and 200 ft',
    );
    expect(localiseBound('Occupants must be between 0 and 20 people', 'plain', 'metric')).toBe(
      'Occupants must be between 0 and 20 people',
    );
    expect(localiseBound('Length: enter a number', 'ft', 'metric')).toBe('Length: enter a number');
    expect(localiseBound('Area must be between 1 and 5000 ft²', 'ft', 'metric')).toBe(
      'Area must be between 1 and 5000 ft²',
    );
    expect(localiseBound(undefined, 'ft', 'metric')).toBeUndefined();
  });
});
