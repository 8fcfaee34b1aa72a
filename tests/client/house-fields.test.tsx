import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { houseSchema } from '@calc';
import { HouseFields } from '../../client/src/features/walkthrough/components/house-fields';

describe('the whole house: how much heat it stores', () => {
  it('shows medium when none is chosen, saves a chosen class that calc accepts, and drops it again on medium', () => {
    const onChange = vi.fn();
    const { rerender } = render(<HouseFields value={{ bedrooms: 3 }} onChange={onChange} />);
    const select = screen.getByLabelText<HTMLSelectElement>('How much heat the house stores');
    expect(select.value).toBe('medium');
    expect(screen.getByText(/Not sure: medium/)).toBeTruthy();
    fireEvent.change(select, { target: { value: 'heavy' } });
    const chosen = onChange.mock.calls.at(-1)?.[0];
    expect(chosen).toEqual({ bedrooms: 3, thermalMass: 'heavy' });
    expect(houseSchema.parse(chosen)).toMatchObject({ thermalMass: 'heavy' });
    rerender(<HouseFields value={chosen} onChange={onChange} />);
    fireEvent.change(screen.getByLabelText('How much heat the house stores'), { target: { value: 'medium' } });
    expect(onChange.mock.calls.at(-1)?.[0]).toEqual({ bedrooms: 3 });
  });
});
