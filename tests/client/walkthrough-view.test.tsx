import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { WalkthroughView } from '../../client/src/features/walkthrough/components/walkthrough-view';
import { roomTarget, type WalkthroughEdit } from '../../client/src/features/walkthrough/sync/edits';
import { overlayRooms } from '../../client/src/features/walkthrough/sync/overlay';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import type { QueueItem } from '../../client/src/lib/offline/queue';
import { createQueryClient } from '../../client/src/lib/query-client';
import { bedroomInput, JOB_ID, jobRecord, renderWalkthrough, ROOM_ID, roomRecord } from './helpers/walkthrough-harness';

/** A query cache holding what the server returned: the job and one saved bedroom. */
function seeded() {
  const queryClient = createQueryClient();
  queryClient.setQueryData(jobKeys.detail(JOB_ID), jobRecord());
  queryClient.setQueryData(jobKeys.rooms(JOB_ID), [roomRecord(bedroomInput, 3)]);
  queryClient.setQueryData(jobKeys.settings(), {
    unitSystem: 'imperial',
    defaultDesignConditions: null,
    version: 1,
    updatedAt: null,
  });
  return queryClient;
}

const NEW_ID = '33333333-3333-4333-8333-333333333333';
const item = (seq: number, payload: WalkthroughEdit, baseVersion: number | null): QueueItem<WalkthroughEdit> => ({
  id: `e${seq}`,
  seq,
  target: roomTarget('roomId' in payload ? payload.roomId : ''),
  baseVersion,
  payload,
  queuedAt: '2026-01-01T00:00:00.000Z',
});
const waiting = [
  item(
    1,
    {
      kind: 'room-update',
      jobId: JOB_ID,
      roomId: ROOM_ID,
      input: { ...bedroomInput, name: 'Primary bedroom', lengthFt: 15 },
    },
    3,
  ),
  item(
    2,
    {
      kind: 'room-create',
      jobId: JOB_ID,
      roomId: NEW_ID,
      position: 1,
      input: { ...bedroomInput, id: NEW_ID, name: 'Nursery' },
    },
    null,
  ),
];

describe('walk-through after a reload', () => {
  it('lays the queued edits over what the server returned', () => {
    const rooms = overlayRooms(JOB_ID, [roomRecord(bedroomInput, 3)], waiting);
    expect(rooms.map((r) => [r.input.name, r.version, r.waiting])).toEqual([
      ['Primary bedroom', 3, true],
      ['Nursery', null, true],
    ]);
    const deleted = overlayRooms(
      JOB_ID,
      [roomRecord(bedroomInput, 3)],
      [item(3, { kind: 'room-delete', jobId: JOB_ID, roomId: ROOM_ID }, 3)],
    );
    expect(deleted).toEqual([]);
  });

  it('shows every value typed before the reload and says the changes are waiting', async () => {
    await renderWalkthrough(<WalkthroughView jobId={JOB_ID} />, {
      queryClient: seeded(),
      stored: waiting,
      online: () => false,
    });
    const tabs = await screen.findByRole('list', { name: 'Rooms' });
    expect(
      within(tabs)
        .getAllByRole('button')
        .map((b) => b.textContent),
    ).toEqual(['Primary bedroom (not yet saved)', 'Nursery (not yet saved)']);
    expect(screen.getByLabelText('Room name')).toHaveValue('Primary bedroom');
    expect(screen.getByLabelText('Length')).toHaveValue('15');
    expect(screen.getAllByRole('status').some((s) => s.textContent === 'Offline — 2 changes waiting')).toBe(true);
  });
});

describe('adding rooms', () => {
  it('copies the previous room and adds one from a template', async () => {
    const { queue } = await renderWalkthrough(<WalkthroughView jobId={JOB_ID} />, {
      queryClient: seeded(),
      online: () => false,
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Copy room' }));
    await waitFor(() => expect(screen.getByLabelText('Room name')).toHaveValue('Bedroom 2 (copy)'));
    // The copied wall is complete, so it is folded to its line; its fields are made when the line is tapped.
    fireEvent.click(await screen.findByText(/^Wall 1:/));
    expect(await screen.findAllByLabelText('Wall length')).toHaveLength(1);

    fireEvent.change(screen.getByLabelText('Room template'), { target: { value: 'kitchen' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add room' }));
    await waitFor(() => expect(screen.getByLabelText('Room name')).toHaveValue('Kitchen'));
    const kinds = queue.getSnapshot().items.map((i) => i.payload.kind);
    expect(kinds).toEqual(['room-create', 'room-create']);
    expect(queue.getSnapshot().items[0]?.payload).toMatchObject({ input: { name: 'Bedroom 2 (copy)', lengthFt: 12 } });
  });
});

describe('one hand on a phone', () => {
  const twoRooms = () => {
    const queryClient = seeded();
    queryClient.setQueryData(jobKeys.rooms(JOB_ID), [
      roomRecord(bedroomInput, 3),
      { ...roomRecord({ ...bedroomInput, id: NEW_ID, name: 'Den', lengthFt: 9 }, 1), id: NEW_ID, position: 1 },
    ]);
    return queryClient;
  };

  it('a reload opens the room last open, and "Copy room" copies the room that is open', async () => {
    localStorage.clear();
    const first = await renderWalkthrough(<WalkthroughView jobId={JOB_ID} />, {
      queryClient: twoRooms(),
      online: () => false,
    });
    fireEvent.click(await screen.findByRole('button', { name: 'Den' }));
    await waitFor(() => expect(screen.getByLabelText('Room name')).toHaveValue('Den'));
    first.unmount();

    const { queue } = await renderWalkthrough(<WalkthroughView jobId={JOB_ID} />, {
      queryClient: twoRooms(),
      online: () => false,
    });
    await waitFor(() => expect(screen.getByLabelText('Room name')).toHaveValue('Den'));
    fireEvent.click(screen.getByRole('button', { name: 'Copy room' }));
    await waitFor(() => expect(screen.getByLabelText('Room name')).toHaveValue('Den (copy)'));
    expect(queue.getSnapshot().items[0]?.payload).toMatchObject({ input: { name: 'Den (copy)', lengthFt: 9 } });
  });

  it('pins the room’s live loads in one line, and folds a complete wall to a summary', async () => {
    await renderWalkthrough(<WalkthroughView jobId={JOB_ID} />, { queryClient: seeded(), online: () => false });
    const bar = await screen.findByTestId('room-load-bar');
    expect(bar.textContent).toMatch(/^Sensible [\d,]+ · Latent [\d,]+ · Heat loss [\d,]+ Btu\/h$/);
    const wall = screen.getByText('Wall 1: faces W, 10 ft, 1 window, 0 doors').closest('details');
    expect(wall).not.toHaveAttribute('open');
    fireEvent.click(screen.getByRole('button', { name: 'Add wall' }));
    const added = screen.getByText(/^Wall 2: faces N/).closest('details');
    expect(added).toHaveAttribute('open');
  });
});
