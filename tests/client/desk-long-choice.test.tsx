import { fireEvent, render, screen } from '@testing-library/react';
import { FormProvider, useForm } from 'react-hook-form';
import { describe, expect, it } from 'vitest';
import { OptionalSelect } from '../../client/src/features/desk/components/optional-select';

const options = [
  { value: '', label: 'No heat kit' },
  { value: 'hk5', label: 'HK-5 — Demo 5 kW electric heat kit with breaker' },
] as const;

function Harness({ initial }: { initial?: string }) {
  const form = useForm({ defaultValues: { kit: initial } });
  return (
    <FormProvider {...form}>
      <OptionalSelect name="kit" label="Heat kit (backup heat)" options={options} />
    </FormProvider>
  );
}

describe('OptionalSelect on a phone', () => {
  it('writes a long choice out in full under the box (a phone cuts it short), for the eye only', () => {
    render(<Harness initial="hk5" />);
    const full = screen.getByTestId('chosen-in-full');
    expect(full.textContent).toBe(options[1].label);
    expect(full.getAttribute('aria-hidden')).toBe('true');
    expect(full.className).toContain('sm:hidden');
    // The select keeps its name for a screen reader.
    expect(screen.getByRole('combobox', { name: 'Heat kit (backup heat)' })).toBeTruthy();
  });

  it('follows the choice, and says nothing more for a short one', () => {
    render(<Harness />);
    expect(screen.queryByTestId('chosen-in-full')).toBeNull();
    fireEvent.change(screen.getByRole('combobox'), { target: { value: 'hk5' } });
    expect(screen.getByTestId('chosen-in-full').textContent).toBe(options[1].label);
    fireEvent.change(screen.getByRole('combobox'), { target: { value: '' } });
    expect(screen.queryByTestId('chosen-in-full')).toBeNull();
  });
});
