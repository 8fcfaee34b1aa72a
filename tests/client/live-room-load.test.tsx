import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { homeLoad, roomInputSchema, type HomeInput, type RoomInput } from '@calc';
import { RoomLoadBar } from '../../client/src/features/loads/components/room-load-bar';
import { RoomLoadPanel } from '../../client/src/features/loads/components/room-load-panel';
import { ranchHome, ranchRooms } from '../calc/ranch-home';

/**
 * The walk-through's live room figures for a ducted home against the server's full recompute
 * (calc's homeLoad, whose duct terms are the ASHRAE Standard 152 design delivery-effectiveness
 * balance checked in tests/calc/ducts.test.ts): the same numbers, duct share included.
 */
const DUCTS = { location: 'attic', insulationR: 6, leakage: 'typical', roofColor: 'dark' } as const;
const fmt = (n: number) => `${n.toLocaleString('en-US')} Btu/h`;

const living = ranchRooms.find((r) => r.id === 'living');
if (!living) throw new Error('no living room in the ranch');
// The room as it is being typed: more glass on the south wall than was saved.
const draft: RoomInput = {
  ...living,
  exposedWalls: (living.exposedWalls ?? []).map((w, i) =>
    i === 0 ? { ...w, windows: [{ areaFt2: 75, glazing: 'double-clear' }] } : w,
  ),
};
const saved = ranchRooms.map((r) => ({ id: r.id, input: { ...r } as Record<string, unknown> }));

function fullRecompute(house: Record<string, unknown>) {
  const home: HomeInput = { ...ranchHome, ...house, rooms: ranchRooms.map((r) => (r.id === draft.id ? draft : r)) };
  const load = homeLoad({ home }).rooms.find((r) => r.roomId === draft.id);
  if (!load) throw new Error('no living room figures');
  return load;
}

describe('live room loads in a ducted home', () => {
  it('the panel and the pinned bar show the full recompute’s figures for the room being typed, ducts included', async () => {
    const house = { bedrooms: 3, ducts: DUCTS };
    const expected = fullRecompute(house);
    const withoutDucts = fullRecompute({ bedrooms: 3 });
    // the duct share is really in it: calc puts this room's part of the attic ducts in its sensible gain
    expect(expected.sensibleGain.ducts).toBeGreaterThan(0);
    expect(expected.sensibleGain.total).toBeGreaterThan(withoutDucts.sensibleGain.total);
    expect(expected.heatLoss.ducts).toBeGreaterThan(0);

    const room = roomInputSchema.parse(draft);
    const props = {
      room,
      designConditions: ranchHome.designConditions as Record<string, unknown>,
      tightness: 'average' as const,
      home: { rooms: saved, house },
    };
    render(
      <>
        <RoomLoadPanel {...props} warnings={[]} />
        <RoomLoadBar {...props} />
      </>,
    );
    const panel = screen.getByRole('region', { name: 'Room loads' });
    expect(await within(panel).findByTestId('load-sensible-gain')).toHaveTextContent(fmt(expected.sensibleGain.total));
    expect(within(panel).getByTestId('load-latent-gain')).toHaveTextContent(fmt(expected.latentGain.total));
    expect(within(panel).getByTestId('load-heat-loss')).toHaveTextContent(fmt(expected.heatLoss.total));
    expect(within(panel).getByTestId('load-at-the-home’s-peak')).toHaveTextContent(
      fmt(expected.atBlock.sensibleBtuh).replace(' Btu/h', ''),
    );
    expect(screen.getByTestId('room-load-bar')).toHaveTextContent(
      `Sensible ${expected.sensibleGain.total.toLocaleString('en-US')} · Latent ${expected.latentGain.total.toLocaleString('en-US')} · Heat loss ${expected.heatLoss.total.toLocaleString('en-US')} Btu/h`,
    );
  });
});
