import { roomLoad } from '@calc';
import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { RoomEditor } from '../../client/src/features/walkthrough/components/room-editor';
import { SaveStatusPill, saveStatus } from '../../client/src/lib/offline/save-status-pill';
import { LiveSaveStatus } from '../../client/src/features/walkthrough/components/live-save-status';
import { render } from '@testing-library/react';
import {
  bedroomInput,
  designConditions,
  JOB_ID,
  openFolds,
  renderWalkthrough,
  ROOM_ID,
  roomView,
} from './helpers/walkthrough-harness';

afterEach(() => vi.unstubAllGlobals());

const fmt = (n: number) => `${n.toLocaleString('en-US')} Btu/h`;

describe('save status pill', () => {
  const base = { items: [], online: true, sending: false, conflict: null };
  const item = { id: 'e1', seq: 1, target: 'room:a', baseVersion: 1, payload: {}, queuedAt: '' };

  it('says Saved, Saving… or Offline — N changes waiting', () => {
    expect(saveStatus(base, 0)).toEqual({ kind: 'saved' });
    expect(saveStatus(base, 1)).toEqual({ kind: 'saving' });
    expect(saveStatus({ ...base, sending: true, items: [item] }, 0)).toEqual({ kind: 'saving' });
    expect(saveStatus({ ...base, online: false, items: [item, { ...item, id: 'e2' }] }, 0)).toEqual({
      kind: 'offline',
      waiting: 2,
    });
    expect(saveStatus({ ...base, online: false }, 0)).toEqual({ kind: 'saved' });
  });

  it('renders each state in a status region', () => {
    const { rerender } = render(<SaveStatusPill status={{ kind: 'saved' }} />);
    expect(screen.getByRole('status')).toHaveTextContent('Saved');
    rerender(<SaveStatusPill status={{ kind: 'saving' }} />);
    expect(screen.getByRole('status')).toHaveTextContent('Saving…');
    rerender(<SaveStatusPill status={{ kind: 'offline', waiting: 3 }} />);
    expect(screen.getByRole('status')).toHaveTextContent('Offline — 3 changes waiting');
    rerender(<SaveStatusPill status={{ kind: 'offline', waiting: 1 }} />);
    expect(screen.getByRole('status')).toHaveTextContent('Offline — 1 change waiting');
  });

  it('follows the queue: typing shows Saving…, an offline save shows the waiting count', async () => {
    const { queue } = await renderWalkthrough(
      <>
        <LiveSaveStatus />
        <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />
      </>,
      { online: () => false },
    );
    const pill = () => screen.getAllByRole('status').find((s) => /Saved|Saving|Offline/.test(s.textContent ?? ''));
    expect(pill()).toHaveTextContent('Saved');
    fireEvent.change(screen.getByLabelText('Length'), { target: { value: '14' } });
    expect(pill()).toHaveTextContent('Saving…');
    await waitFor(() => expect(pill()).toHaveTextContent('Offline — 1 change waiting'), { timeout: 5000 });
    expect(queue.getSnapshot().items[0]?.payload).toMatchObject({
      kind: 'room-update',
      roomId: ROOM_ID,
      input: { lengthFt: 14 },
    });
    expect(queue.getSnapshot().items[0]?.baseVersion).toBe(3);
  });
});

describe('room form', () => {
  it('shows calc’s message on the window area typed when the window is larger than its wall', async () => {
    await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    const area = screen.getByLabelText('Window area');
    fireEvent.change(area, { target: { value: '100' } });
    expect(await screen.findByText('The window (100 ft²) is larger than its wall (80 ft²)')).toBeInTheDocument();
    expect(area).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByText('Fix the fields marked in red to update the loads.')).toBeInTheDocument();
  });

  it('puts a window larger than its wall on the width and height that were typed, naming both sizes', async () => {
    await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    // 120 in × 120 in = 100 ft²; the wall is 10 ft × 8 ft = 80 ft²
    fireEvent.change(screen.getByLabelText('Window width'), { target: { value: '120' } });
    fireEvent.change(screen.getByLabelText('Window height'), { target: { value: '120' } });
    const message = 'The window (100 ft²) is larger than its wall (80 ft²)';
    expect(await screen.findAllByText(message)).toHaveLength(2);
    expect(screen.getByLabelText('Window width')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Window height')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('Window area')).not.toHaveAttribute('aria-invalid', 'true');
  });

  it('a 0 ft wall marks the wall length only, not the empty window area', async () => {
    await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    fireEvent.change(screen.getByLabelText('Wall length'), { target: { value: '0' } });
    expect(await screen.findByText('Wall length must be between 1 and 200 ft')).toBeInTheDocument();
    expect(screen.getByLabelText('Window area')).not.toHaveAttribute('aria-invalid', 'true');
    expect(screen.queryByText(/larger than/)).not.toBeInTheDocument();
  });

  it('shows bounds from calc’s schema and never saves an invalid room', async () => {
    const { queue } = await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    fireEvent.change(screen.getByLabelText('Ceiling height'), { target: { value: '0.5' } });
    expect(await screen.findByText('Ceiling height must be between 2 and 40 ft')).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText('Room name'), { target: { value: '' } });
    expect(await screen.findByText('Enter a room name')).toBeInTheDocument();
    await new Promise((r) => setTimeout(r, 800));
    expect(queue.getSnapshot().items).toHaveLength(0);
  });

  it('adds a wall and a window with the buttons', async () => {
    await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    fireEvent.click(screen.getByRole('button', { name: 'Add wall' }));
    expect(screen.getAllByLabelText('Wall length')).toHaveLength(2);
    fireEvent.click(screen.getAllByRole('button', { name: 'Add window' })[1] ?? document.body);
    expect(screen.getAllByLabelText('Window width')).toHaveLength(2);
  });

  it('updates the live loads as an input changes, with calc’s numbers', async () => {
    await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    const panel = screen.getByRole('region', { name: 'Room loads' });
    const before = roomLoad({ room: bedroomInput, designConditions, tightness: 'average' });
    expect(within(panel).getByTestId('load-sensible-gain')).toHaveTextContent(fmt(before.sensibleGain.total));
    expect(within(panel).getByTestId('load-heat-loss')).toHaveTextContent(fmt(before.heatLoss.total));

    await act(async () => {
      fireEvent.change(screen.getByLabelText('Occupants'), { target: { value: '4' } });
    });
    const after = roomLoad({ room: { ...bedroomInput, occupants: 4 }, designConditions, tightness: 'average' });
    expect(after.sensibleGain.total).toBeGreaterThan(before.sensibleGain.total);
    expect(within(panel).getByTestId('load-sensible-gain')).toHaveTextContent(fmt(after.sensibleGain.total));
    expect(within(panel).getByTestId('load-latent-gain')).toHaveTextContent(fmt(after.latentGain.total));
  });

  it('shows plain-word warnings for an unusual ceiling', async () => {
    await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    fireEvent.change(screen.getByLabelText('Ceiling height'), { target: { value: '6' } });
    expect(await screen.findByText(/6 ft ceiling is unusually low/)).toBeInTheDocument();
  });
});

describe('a draft the schema refuses', () => {
  it('is kept on the device and comes back after a reload, and is dropped once the room is valid', async () => {
    const first = await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    fireEvent.change(screen.getByLabelText('Window area'), { target: { value: '100' } });
    expect(await screen.findByText('The window (100 ft²) is larger than its wall (80 ft²)')).toBeInTheDocument();
    first.unmount();
    // "reload": a fresh editor for the same room at the same version
    const sent: unknown[] = [];
    const second = await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
      {
        send: async (item) => (sent.push(item.payload), { kind: 'ok', version: 4 }),
      },
    );
    await openFolds();
    expect(screen.getByLabelText('Window area')).toHaveValue('100');
    expect(screen.getByText(/Brought back what you were typing/)).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText('Window area'), { target: { value: '20' } });
    await waitFor(() => expect(sent).toHaveLength(1), { timeout: 5000 });
    second.unmount();
    await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    expect(screen.getByLabelText('Window area')).not.toHaveValue('100');
  });

  it('is discarded when the room on the server has moved on', async () => {
    const first = await renderWalkthrough(
      <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    );
    await openFolds();
    fireEvent.change(screen.getByLabelText('Window area'), { target: { value: '100' } });
    first.unmount();
    await renderWalkthrough(
      <RoomEditor
        jobId={JOB_ID}
        room={roomView(bedroomInput, 4)}
        designConditions={designConditions}
        tightness="average"
      />,
    );
    await openFolds();
    expect(screen.getByLabelText('Window area')).not.toHaveValue('100');
  });
});
