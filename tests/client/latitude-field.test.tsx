import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { LatitudeField } from '../../client/src/features/walkthrough/components/latitude-field';

describe('latitude as degrees and a hemisphere', () => {
  it('sends south as negative, and shows a stored southern latitude as degrees with S pressed', () => {
    const onChange = vi.fn();
    const { rerender } = render(<LatitudeField value={undefined} error={undefined} hint="" onChange={onChange} />);
    fireEvent.click(screen.getByRole('button', { name: 'South (S)' }));
    fireEvent.change(screen.getByLabelText('Latitude'), { target: { value: '33.9' } });
    expect(onChange).toHaveBeenLastCalledWith(-33.9);
    rerender(<LatitudeField value={-33.9} error={undefined} hint="" onChange={onChange} />);
    expect(screen.getByLabelText('Latitude')).toHaveValue('33.9');
    expect(screen.getByRole('button', { name: 'South (S)' })).toHaveAttribute('aria-pressed', 'true');
    fireEvent.click(screen.getByRole('button', { name: 'North (N)' }));
    expect(onChange).toHaveBeenLastCalledWith(33.9);
  });

  it('says calc’s signed bounds in hemisphere words', () => {
    render(
      <LatitudeField value={-65} error="Latitude must be between -60 and 70 °" hint="" onChange={() => undefined} />,
    );
    expect(screen.getByText('Latitude must be between 60° S and 70° N')).toBeVisible();
  });
});
