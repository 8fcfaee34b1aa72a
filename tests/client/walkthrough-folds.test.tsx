import { fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { RoomEditor } from '../../client/src/features/walkthrough/components/room-editor';
import { bedroomInput, designConditions, JOB_ID, renderWalkthrough, roomView } from './helpers/walkthrough-harness';

afterEach(() => vi.unstubAllGlobals());

/** The <details> a folded line belongs to, found by the line's text. */
function foldOf(text: RegExp): HTMLDetailsElement {
  const summary = screen.getAllByText(text)[0]?.closest('summary');
  const details = summary?.parentElement;
  if (!(details instanceof HTMLDetailsElement)) throw new Error(`no fold for ${String(text)}`);
  return details;
}

async function editor(input: Record<string, unknown> = bedroomInput) {
  return renderWalkthrough(
    <RoomEditor jobId={JOB_ID} room={roomView(input)} designConditions={designConditions} tightness="average" />,
  );
}

describe('complete parts of a room fold to one line (issue 10: one hand on a phone)', () => {
  it('a complete window, the above/below section and the people section open folded, each with its summary', async () => {
    await editor();
    expect(foldOf(/^Above: Attic, R-30 · Below: Slab on grade, edge not insulated$/).open).toBe(false);
    expect(foldOf(/^2 people · no appliances$/).open).toBe(false);
    // The wall the window is in folds too (as before); the window's line is inside it, folded as well.
    const wall = foldOf(/^Wall 1: faces W, 10 ft, 1 window, 0 doors$/);
    expect(wall.open).toBe(false);
    fireEvent.click(wall.querySelector('summary') as HTMLElement);
    await screen.findByText(/^Window 1: 36 × 48 in, Double/);
    expect(foldOf(/^Window 1: 36 × 48 in, Double/).open).toBe(false);
  });

  it("a folded part's fields are made when its line is first tapped, and kept when it folds again (issue 11)", async () => {
    await editor();
    const people = foldOf(/^2 people/);
    // Folded: only its line (fields drawn hidden still cost a phone layout whenever the browser looks at them).
    expect(people.querySelector('input')).toBeNull();
    expect(screen.queryByLabelText('Occupants')).toBeNull();
    fireEvent.click(people.querySelector('summary') as HTMLElement);
    await waitFor(() => expect(people.open).toBe(true));
    expect(screen.getByLabelText('Occupants')).toHaveValue('2');
    fireEvent.click(people.querySelector('summary') as HTMLElement);
    await waitFor(() => expect(people.open).toBe(false));
    expect(screen.getByLabelText('Occupants')).toHaveValue('2');
  });

  it('a tap on the line opens it; a field typed there updates the line', async () => {
    await editor();
    const people = foldOf(/^2 people/);
    fireEvent.click(people.querySelector('summary') as HTMLElement);
    await waitFor(() => expect(people.open).toBe(true));
    fireEvent.change(screen.getByLabelText('Occupants'), { target: { value: '3' } });
    expect(screen.getByText('3 people · no appliances')).toBeInTheDocument();
  });

  it('what is incomplete or wrong starts open and stays open', async () => {
    await editor({
      ...bedroomInput,
      occupants: undefined,
      below: { kind: 'basement-floor', insulationR: 0 },
      exposedWalls: [{ ...bedroomInput.exposedWalls[0], windows: [{ count: 1, glazing: 'double-clear' }] }],
    });
    expect(foldOf(/^Window 1: no size yet/).open).toBe(true);
    expect(foldOf(/^Above: Attic, R-30 · Below: Ground .+, no depth yet$/).open).toBe(true);
    expect(foldOf(/^no occupants yet · no appliances$/).open).toBe(true);
  });

  it('a field showing an error keeps its section open even when the line is tapped', async () => {
    await editor();
    const people = foldOf(/^2 people/);
    fireEvent.click(people.querySelector('summary') as HTMLElement);
    await waitFor(() => expect(people.open).toBe(true));
    fireEvent.change(screen.getByLabelText('Occupants'), { target: { value: '400' } });
    expect(screen.getByLabelText('Occupants')).toHaveAttribute('aria-invalid', 'true');
    fireEvent.click(people.querySelector('summary') as HTMLElement);
    await waitFor(() => expect(people.open).toBe(true));
  });

  it('a window added now opens to be filled in while the one the wall came with stays folded', async () => {
    await editor();
    fireEvent.click(foldOf(/^Wall 1:/).querySelector('summary') as HTMLElement);
    fireEvent.click(screen.getByRole('button', { name: 'Add window' }));
    expect(foldOf(/^Window 1:/).open).toBe(false);
    expect(foldOf(/^Window 2: 36 × 48 in/).open).toBe(true);
  });
});
