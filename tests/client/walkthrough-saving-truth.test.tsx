import { act, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { RoomEditor } from '../../client/src/features/walkthrough/components/room-editor';
import { LiveSaveStatus } from '../../client/src/features/walkthrough/components/live-save-status';
import {
  jobTarget,
  roomTarget,
  type WalkthroughEdit,
  type WalkthroughItem,
} from '../../client/src/features/walkthrough/sync/edits';
import { createEditSender } from '../../client/src/features/walkthrough/sync/send-edit';
import { saveablePart } from '../../client/src/features/walkthrough/model/saveable';
import { createQueryClient } from '../../client/src/lib/query-client';
import {
  bedroomInput,
  designConditions,
  JOB_ID,
  jobRecord,
  openFolds,
  renderWalkthrough,
  ROOM_ID,
  roomRecord,
  roomView,
} from './helpers/walkthrough-harness';

afterEach(() => {
  vi.unstubAllGlobals();
  localStorage.clear();
});

const pill = () =>
  screen.getAllByRole('status').find((s) => /Saved|Saving|Offline|Not saved/.test(s.textContent ?? ''));

async function editor(sent: WalkthroughEdit[], room = roomView()) {
  const view = await renderWalkthrough(
    <>
      <LiveSaveStatus />
      <RoomEditor jobId={JOB_ID} room={room} designConditions={designConditions} tightness="average" />
    </>,
    { send: async (item) => (sent.push(item.payload), { kind: 'ok', version: (room.version ?? 0) + sent.length }) },
  );
  // The room's folded parts (walls, windows, people) make their fields when first opened.
  await openFolds();
  return view;
}

const inputOf = (e: WalkthroughEdit | undefined) => (e && e.kind === 'room-update' ? e.input : undefined);
const settle = () => act(() => new Promise((r) => setTimeout(r, 800)));

describe('a value refused on screen is never sent', () => {
  it('typing 1000 in Length (limit 200 ft) never sends 100, the prefix typed on the way', async () => {
    const sent: WalkthroughEdit[] = [];
    await editor(sent);
    const length = screen.getByLabelText('Length');
    for (const typed of ['1', '10', '100', '1000']) fireEvent.change(length, { target: { value: typed } });
    expect(await screen.findByText('Length must be between 1 and 200 ft')).toBeInTheDocument();
    await settle();
    expect(sent.map((e) => inputOf(e)?.lengthFt)).not.toContain(100);
    expect(sent).toHaveLength(0);
    expect(pill()).toHaveTextContent('Not saved — 1 field to fix');
  });

  it('with one wall out of range, the room’s other edits are sent and the pill says what is not saved', async () => {
    const sent: WalkthroughEdit[] = [];
    await editor(sent);
    fireEvent.change(screen.getByLabelText('Wall length'), { target: { value: '250' } });
    fireEvent.change(screen.getByLabelText('Occupants'), { target: { value: '4' } });
    fireEvent.change(screen.getByLabelText('Notes'), { target: { value: 'North bedroom' } });
    await waitFor(() => expect(sent).toHaveLength(1), { timeout: 5000 });
    const input = inputOf(sent[0]);
    expect(input).toMatchObject({ occupants: 4, notes: 'North bedroom' });
    // The refused wall keeps its saved value in what was sent.
    expect(input?.exposedWalls).toEqual(bedroomInput.exposedWalls);
    expect(pill()).toHaveTextContent('Not saved — 1 field to fix');
    expect(pill()).not.toHaveTextContent(/^Saved/);

    // The pill is one tap from the field to fix.
    fireEvent.click(screen.getByRole('button', { name: /Not saved — 1 field to fix/ }));
    expect(document.activeElement).toBe(screen.getByLabelText('Wall length'));

    fireEvent.change(screen.getByLabelText('Wall length'), { target: { value: '25' } });
    await waitFor(() => expect(sent).toHaveLength(2), { timeout: 5000 });
    expect(inputOf(sent[1])?.exposedWalls).toMatchObject([{ lengthFt: 25 }]);
    await waitFor(() => expect(pill()).toHaveTextContent('Saved'));
  });

  it('a refused room-wide rule (no length, width or area) sends nothing and says so', async () => {
    const sent: WalkthroughEdit[] = [];
    await editor(sent);
    fireEvent.change(screen.getByLabelText('Width'), { target: { value: '' } });
    await settle();
    expect(sent).toHaveLength(0);
    expect(pill()).toHaveTextContent('Not saved — 1 field to fix');
  });

  it('brings the whole draft back after a reload even though its valid part was saved (the version moved)', async () => {
    const sent: WalkthroughEdit[] = [];
    const first = await editor(sent);
    fireEvent.change(screen.getByLabelText('Wall length'), { target: { value: '250' } });
    fireEvent.change(screen.getByLabelText('Occupants'), { target: { value: '4' } });
    await waitFor(() => expect(sent).toHaveLength(1), { timeout: 5000 });
    first.unmount();
    const saved = inputOf(sent[0]) ?? {};
    await editor([], roomView(saved, 4));
    expect(screen.getByLabelText('Wall length')).toHaveValue('250');
    expect(screen.getByLabelText('Occupants')).toHaveValue('4');
  });
});

describe('saveablePart', () => {
  it('puts each refused top-level field back to its saved value and keeps the rest', () => {
    const draft = { ...bedroomInput, occupants: 3, ceilingHeightFt: 0.5, notes: 'x' };
    expect(saveablePart(draft, bedroomInput)).toEqual({ ...bedroomInput, occupants: 3, notes: 'x' });
  });

  it('puts length, width and area back together (calc checks them together)', () => {
    const draft: Record<string, unknown> = { ...bedroomInput, occupants: 3 };
    delete draft.widthFt;
    expect(saveablePart(draft, bedroomInput)).toEqual({ ...bedroomInput, occupants: 3 });
  });
});

describe('a replay the server already holds', () => {
  const roomEdit = (input: Record<string, unknown>): WalkthroughItem => ({
    id: 'e1',
    seq: 1,
    target: roomTarget(ROOM_ID),
    baseVersion: 3,
    queuedAt: '2026-01-01T00:00:00.000Z',
    payload: { kind: 'room-update', jobId: JOB_ID, roomId: ROOM_ID, input },
  });

  function server(current: Record<string, unknown>) {
    const answers = { room: roomRecord(current, 5), job: jobRecord({ version: 7, ...current }) };
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: RequestInfo | URL, init?: RequestInit) => {
        const method = init?.method ?? 'GET';
        if (String(url) === '/api/auth/csrf') return Response.json({ token: 't' });
        if (method === 'PATCH')
          return Response.json(
            { type: '/problems/conflict', title: 'Conflict', status: 409, detail: 'Changed meanwhile.' },
            { status: 409, headers: { 'Content-Type': 'application/problem+json' } },
          );
        if (String(url).includes('/rooms/')) return Response.json({ room: answers.room });
        return Response.json({ job: answers.job });
      }),
    );
  }

  it('settles a room edit whose values the server already has (Yours = Theirs): no conflict', async () => {
    // Same values, another key order: still the same room.
    const reordered = Object.fromEntries(Object.entries(bedroomInput).reverse());
    server(reordered);
    const result = await createEditSender(createQueryClient())(roomEdit(bedroomInput));
    expect(result).toEqual({ kind: 'ok', version: 5 });
  });

  it('still asks when a field really differs', async () => {
    server({ ...bedroomInput, occupants: 5 });
    const result = await createEditSender(createQueryClient())(roomEdit(bedroomInput));
    expect(result).toEqual({ kind: 'conflict' });
  });

  it('settles a job edit the job already holds, and asks when it does not', async () => {
    const edit = (tightness: string): WalkthroughItem => ({
      id: 'j1',
      seq: 1,
      target: jobTarget(JOB_ID),
      baseVersion: 2,
      queuedAt: '2026-01-01T00:00:00.000Z',
      payload: { kind: 'job-update', jobId: JOB_ID, changes: { tightness, notes: 'Gate code 12' } },
    });
    server({ tightness: 'average', notes: 'Gate code 12' });
    expect(await createEditSender(createQueryClient())(edit('average'))).toEqual({ kind: 'ok', version: 7 });
    expect(await createEditSender(createQueryClient())(edit('tight'))).toEqual({ kind: 'conflict' });
  });
});
