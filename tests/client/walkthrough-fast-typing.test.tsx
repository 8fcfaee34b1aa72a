import { act, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { RoomEditor } from '../../client/src/features/walkthrough/components/room-editor';
import type { WalkthroughEdit } from '../../client/src/features/walkthrough/sync/edits';
import {
  bedroomInput,
  designConditions,
  JOB_ID,
  openFolds,
  renderWalkthrough,
  roomView,
} from './helpers/walkthrough-harness';

/*
 * Issue 11: a keystroke re-renders only the field typed in (and what shows its value), so the walls, the
 * above/below and the appliances parts keep what they rendered last while another field is typed. Whatever
 * they change afterwards must start from the room as it stands, and every edit typed in a burst must reach
 * the queue whole: the queue is what the office gets, on or off line.
 */

afterEach(() => localStorage.clear());

const inputOf = (e: WalkthroughEdit | undefined) => (e && e.kind === 'room-update' ? e.input : undefined);

async function editor() {
  const sent: WalkthroughEdit[] = [];
  const view = await renderWalkthrough(
    <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />,
    { send: async (item) => (sent.push(item.payload), { kind: 'ok', version: 3 + sent.length }) },
  );
  // The room's folded parts (walls, windows, people) make their fields when first opened.
  await openFolds();
  return { sent, ...view };
}

/** Types `text` one letter at a time, as fast as events come: no wait between the letters. */
function typeInto(field: HTMLElement, text: string) {
  const start = (field as HTMLInputElement).value;
  for (let i = 1; i <= text.length; i += 1) fireEvent.change(field, { target: { value: start + text.slice(0, i) } });
}

// Thirty-odd keystrokes and a save each: under a full `npm test` on two cores this takes longer than vitest's 5 s.
describe('edits typed fast reach the queue intact', { timeout: 20_000 }, () => {
  it('a burst over several fields and parts is sent once, with every letter and value', async () => {
    const { sent } = await editor();
    typeInto(screen.getByLabelText('Room name'), ' north');
    typeInto(await screen.findByLabelText('Wall length'), '5');
    typeInto(screen.getByLabelText('Width'), '1');
    typeInto(screen.getByLabelText('Notes'), 'Closet on the east side');
    fireEvent.change(screen.getByLabelText('Below the room'), { target: { value: 'crawlspace' } });
    await waitFor(() => expect(sent).toHaveLength(1), { timeout: 3000 });
    expect(inputOf(sent[0])).toMatchObject({
      name: 'Bedroom 2 north',
      widthFt: 101,
      notes: 'Closet on the east side',
      below: { kind: 'crawlspace' },
      exposedWalls: [{ lengthFt: 105, windows: bedroomInput.exposedWalls[0]?.windows }],
    });
    // Every field shows what was typed: none was left behind by a part that did not render again.
    expect(screen.getByLabelText('Room name')).toHaveValue('Bedroom 2 north');
    expect(screen.getByLabelText('Wall length')).toHaveValue('105');
    expect(screen.getByLabelText('Width')).toHaveValue('101');
  });

  it('a part that did not render during the typing adds and removes on the room as typed', async () => {
    const { sent } = await editor();
    const wall = (await screen.findByRole('group', { name: 'Wall 1' })) as HTMLElement;
    // Typed in the room's own fields: the wall's part is not rendered again for these.
    typeInto(screen.getByLabelText('Room name'), ' north');
    typeInto(screen.getByLabelText('Notes'), 'Bay window');
    fireEvent.click(within(wall).getByRole('button', { name: 'Add window' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add appliance' }));
    await waitFor(() => expect(sent).toHaveLength(1), { timeout: 3000 });
    const input = inputOf(sent[0]);
    expect(input).toMatchObject({ name: 'Bedroom 2 north', notes: 'Bay window' });
    expect((input?.exposedWalls as { windows: unknown[] }[])[0]?.windows).toHaveLength(2);
    expect(input?.appliances).toHaveLength(1);

    // And back: the window removed from the wall after more typing elsewhere keeps that typing.
    typeInto(screen.getByLabelText('Room name'), ' 2');
    fireEvent.click(within(wall).getByRole('button', { name: 'Remove window 2' }));
    await waitFor(() => expect(sent).toHaveLength(2), { timeout: 3000 });
    expect(inputOf(sent[1])).toMatchObject({
      name: 'Bedroom 2 north 2',
      notes: 'Bay window',
      exposedWalls: [{ windows: bedroomInput.exposedWalls[0]?.windows }],
    });
  });

  it('keys handled before the form renders again each build on the one before', async () => {
    const { sent } = await editor();
    const name = screen.getByLabelText('Room name');
    const notes = screen.getByLabelText('Notes');
    // Inside one act the renders wait until it ends (a phone's keys arriving behind a long render).
    act(() => {
      fireEvent.change(name, { target: { value: 'Den' } });
      fireEvent.change(notes, { target: { value: 'Skylight' } });
    });
    await waitFor(() => expect(sent).toHaveLength(1), { timeout: 3000 });
    expect(inputOf(sent[0])).toMatchObject({ name: 'Den', notes: 'Skylight', occupants: 2 });
  });
});
