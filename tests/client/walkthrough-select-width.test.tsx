import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { SelectInput } from '../../client/src/features/walkthrough/components/field-kit';
import {
  belowOptions,
  ceilingInsulationOptions,
  constructionOptions,
} from '../../client/src/features/walkthrough/model/options';

/*
 * On a 375 px phone the walk-through's fields sit two to a row, and a select there showed about 14 characters:
 * "2×4 wood fran…", "Double pan…". A select whose choices are longer takes the whole row of a two-column grid,
 * and a choice longer than a whole row is also written out under the box (for the eye; the select tells a
 * screen reader), as the desk's selects do.
 */
const box = (label: string) => screen.getByLabelText(label).closest('div');

describe("the walk-through's selects on a phone", () => {
  it('a select with long choices spans the two-column row; one with short choices keeps its half', () => {
    render(
      <div className="grid grid-cols-2">
        <SelectInput label="Construction" value="wood-2x4-r13" options={constructionOptions} onChange={() => {}} />
        <SelectInput
          label="Ceiling insulation"
          value={ceilingInsulationOptions[0]!.value}
          options={ceilingInsulationOptions}
          onChange={() => {}}
        />
      </div>,
    );
    expect(box('Construction')?.className).toContain('[.grid-cols-2>&]:col-span-2');
    expect(box('Ceiling insulation')?.className).not.toContain('col-span-2');
    // "2×4 wood frame, R-13 batt" fits a whole row, so it is not written out again.
    expect(screen.queryByTestId('chosen-in-full')).toBeNull();
  });

  it('a choice longer than a whole row is written out under the box, hidden from a screen reader', () => {
    const longest = belowOptions.reduce((a, b) => (b.label.length > a.label.length ? b : a));
    expect(longest.label.length).toBeGreaterThan(30);
    render(<SelectInput label="Below" value={longest.value} options={belowOptions} onChange={() => {}} />);
    const written = screen.getByTestId('chosen-in-full');
    expect(written).toHaveTextContent(longest.label);
    expect(written).toHaveAttribute('aria-hidden', 'true');
    expect(screen.getByLabelText('Below')).toHaveDisplayValue(longest.label);
  });
});
