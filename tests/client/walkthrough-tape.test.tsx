import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { RoomEditor } from '../../client/src/features/walkthrough/components/room-editor';
import {
  designConditions,
  JOB_ID,
  openFolds,
  renderWalkthrough,
  ROOM_ID,
  roomView,
} from './helpers/walkthrough-harness';

const editor = () => (
  <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />
);

describe('length fields take tape-measure entry', () => {
  it(`stores 12'6" as 12.5 ft and shows what it understood`, async () => {
    // 12 ft 6 in = 12 + 6/12 ft (feet-and-inches notation: common practice).
    const { queue } = await renderWalkthrough(editor(), { online: () => false });
    const length = screen.getByLabelText('Length');
    fireEvent.change(length, { target: { value: `12'6"` } });
    expect(screen.getByText('= 12 ft 6 in')).toBeInTheDocument();
    expect(length).not.toHaveAttribute('aria-invalid');
    expect(length).toHaveValue(`12'6"`);
    await waitFor(() => expect(queue.getSnapshot().items).toHaveLength(1), { timeout: 5000 });
    expect(queue.getSnapshot().items[0]?.payload).toMatchObject({
      kind: 'room-update',
      roomId: ROOM_ID,
      input: { lengthFt: 12.5 },
    });
  });

  it('echoes inches as feet and inches, and stays quiet for whole feet', async () => {
    // 150 in = 12 ft 6 in (12 in per ft, definition).
    await renderWalkthrough(editor(), { online: () => false });
    const width = screen.getByLabelText('Width');
    fireEvent.change(width, { target: { value: '150"' } });
    expect(screen.getByText('= 12 ft 6 in')).toBeInTheDocument();
    fireEvent.change(width, { target: { value: '12' } });
    expect(screen.queryByText(/^= /)).not.toBeInTheDocument();
  });

  it('asks about 12,5 on the field and sends nothing', async () => {
    const { queue } = await renderWalkthrough(editor(), { online: () => false });
    const length = screen.getByLabelText('Length');
    fireEvent.change(length, { target: { value: '12,5' } });
    expect(await screen.findByText(/Did you mean 12\.5 ft\?/)).toBeInTheDocument();
    expect(length).toHaveAttribute('aria-invalid', 'true');
    await new Promise((r) => setTimeout(r, 800));
    expect(queue.getSnapshot().items).toHaveLength(0);
  });
});

describe('inch fields take tape-measure entry too', () => {
  it(`stores a window 3'2" wide as 38 in, keeps a plain number as inches, and asks about 36,5`, async () => {
    // 3 ft 2 in = 3 × 12 + 2 = 38 in (12 in per ft, definition).
    const { queue } = await renderWalkthrough(editor(), { online: () => false });
    await openFolds();
    const width = screen.getByLabelText('Window width');
    fireEvent.change(width, { target: { value: `3'2"` } });
    expect(screen.getByText('= 3 ft 2 in')).toBeInTheDocument();
    expect(width).not.toHaveAttribute('aria-invalid');
    await waitFor(() => expect(queue.getSnapshot().items).toHaveLength(1), { timeout: 5000 });
    expect(queue.getSnapshot().items[0]?.payload).toMatchObject({
      input: { exposedWalls: [{ windows: [{ widthIn: 38 }] }] },
    });
    fireEvent.change(width, { target: { value: '40' } });
    await waitFor(
      () =>
        expect(queue.getSnapshot().items[0]?.payload).toMatchObject({
          input: { exposedWalls: [{ windows: [{ widthIn: 40 }] }] },
        }),
      { timeout: 5000 },
    );
    fireEvent.change(width, { target: { value: '36,5' } });
    expect(await screen.findByText('Did you mean 36.5 in?')).toBeInTheDocument();
  });
});
