import { render, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { RoomTabs } from '../../client/src/features/walkthrough/components/room-tabs';
import type { RoomView } from '../../client/src/features/walkthrough/sync/overlay';

const rooms: RoomView[] = Array.from({ length: 30 }, (_, i) => ({
  id: `room-${i + 1}`,
  position: i,
  input: { name: `Bedroom ${i + 1}` },
  version: 1,
  photos: [],
  waiting: false,
}));

describe("a big job's room tabs (issue 11: the first render draws what a phone shows first)", () => {
  it('draws the first dozen, or on to the chosen room, first; every room once the page has been idle, a couple of dozen at each idle moment', async () => {
    render(
      <>
        <nav aria-label="first">
          <RoomTabs rooms={rooms} selectedId="room-1" onSelect={() => undefined} />
        </nav>
        <nav aria-label="twentieth">
          <RoomTabs rooms={rooms} selectedId="room-20" onSelect={() => undefined} />
        </nav>
      </>,
    );
    const first = screen.getByRole('navigation', { name: 'first' });
    const twentieth = screen.getByRole('navigation', { name: 'twentieth' });
    const names = (nav: HTMLElement) =>
      within(nav)
        .getAllByRole('button')
        .map((b) => b.textContent);
    expect(names(first)).toEqual(rooms.slice(0, 12).map((r) => r.input.name));
    expect(names(twentieth)).toEqual(rooms.slice(0, 20).map((r) => r.input.name));
    expect(within(twentieth).getByRole('button', { name: 'Bedroom 20' })).toHaveAttribute('aria-pressed', 'true');

    await waitFor(() => expect(names(first)).toHaveLength(30));
    await waitFor(() => expect(names(twentieth)).toHaveLength(30));
    expect(names(first)).toEqual(rooms.map((r) => r.input.name));
    expect(names(twentieth)).toEqual(rooms.map((r) => r.input.name));
  });
});
