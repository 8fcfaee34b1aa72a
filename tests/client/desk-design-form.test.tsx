import { QueryClientProvider, useQuery } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { json, mockFetch } from './helpers/fetch-mock';
import type { OptionRecord, RoomRecord } from '@contract';
import { DesignForm } from '../../client/src/features/desk/components/design-form';
import type { DeskModel } from '../../client/src/features/desk/api/get-models';
import { deskQueryOptions } from '../../client/src/features/desk/api/get-desk';
import { createQueryClient } from '../../client/src/lib/query-client';

const model = (key: string, kind: string, indoorType = ''): DeskModel => ({
  key,
  name: key,
  kind,
  seer2: null,
  hspf2: null,
  soundDba: null,
  nominalCoolingBtuh: null,
  ports: null,
  indoorType,
  heatKitKw: null,
  matchedKeys: [],
});
const models = [model('IN-9', 'indoor', 'wall'), model('OUT-9', 'outdoor-single-zone')];
const room = (id: string, position: number): RoomRecord =>
  ({ id, position, input: { name: `Room ${id}` } }) as unknown as RoomRecord;
const rooms = [room('r1', 0), room('r2', 1)];

/** An option as the server answers with it: the design as calc's schema stored it (defaults filled). */
const option = {
  id: 'o1',
  jobId: 'j1',
  position: 0,
  name: 'Essential',
  version: 3,
  pricing: null,
  takeoffEdits: [],
  discountRequest: null,
  preliminary: false,
  reviewedBy: null,
  reviewedAt: null,
  result: null,
  problems: [],
  blockers: [],
  createdBy: null,
  createdAt: '2026-12-01T00:00:00.000Z',
  updatedAt: '2026-12-01T00:00:00.000Z',
  design: {
    zones: [{ key: 'zone-1', name: 'Zone 1', roomIds: ['r1', 'r2'], indoorUnitKey: 'IN-9' }],
    systems: [
      {
        key: 'sys-1',
        name: 'Outdoor unit 1',
        outdoorUnitKey: 'OUT-9',
        mounting: 'pad',
        circuits: [
          {
            zoneKey: 'zone-1',
            lengthFt: 25,
            liftFt: 0,
            wallPenetrations: 1,
            lineCoverFt: 0,
            condensate: 'gravity',
            condensateLengthFt: 10,
          },
        ],
        electrical: {
          terminationC: 60,
          wiringMethod: 'nm-b',
          circuitLengthFt: 30,
          disconnectDistanceFt: 5,
          disconnectVisible: true,
        },
      },
    ],
  },
} as unknown as OptionRecord;

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('the desk’s design form', () => {
  it('a stored design opens unchanged: nothing says "Not saved yet" before anyone types', async () => {
    render(
      <QueryClientProvider client={createQueryClient()}>
        <DesignForm jobId="j1" option={option} rooms={rooms} models={models} canEdit whys={new Map()} />
      </QueryClientProvider>,
    );
    await screen.findByRole('button', { name: 'Save design' });
    // Every select shows the stored unit (an uncontrolled select in a field-array row took its first choice).
    expect(screen.getByLabelText('Indoor unit')).toHaveValue('IN-9');
    expect(screen.getByLabelText('Outdoor unit')).toHaveValue('OUT-9');
    expect(screen.getByRole('status').textContent).toBe('');
  });

  it('after a save it says "Saved": the form holds what the server stored', async () => {
    let stored: OptionRecord = option;
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'PATCH /api/jobs/j1/options/o1': (init) => {
        const sent = JSON.parse(String(init?.body)) as { design: Record<string, unknown> };
        stored = { ...stored, version: stored.version + 1, design: sent.design };
        return json(200, { option: stored });
      },
      'GET /api/jobs/j1/desk': () =>
        json(200, {
          jobId: 'j1',
          jobStatus: 'design',
          options: [stored],
          readiness: { markedReady: null, sizingOverride: null, ready: false, blockers: [] },
        }),
    });
    // As the desk does: the option on screen is the one in the desk's query.
    function Desk() {
      const o = useQuery(deskQueryOptions('j1')).data?.options[0];
      return o ? <DesignForm jobId="j1" option={o} rooms={rooms} models={models} canEdit whys={new Map()} /> : null;
    }
    render(
      <QueryClientProvider client={createQueryClient()}>
        <Desk />
      </QueryClientProvider>,
    );
    fireEvent.change(await screen.findByLabelText('Line-set length (ft)'), { target: { value: '40' } });
    expect(screen.getByRole('status').textContent).toBe('Not saved yet');
    fireEvent.click(screen.getByRole('button', { name: 'Save design' }));
    await waitFor(() => expect(screen.getByRole('status').textContent).toBe('Saved'));
    expect(stored.design).toMatchObject({ systems: [{ circuits: [{ lengthFt: 40 }] }] });
  });
});

describe('the heat kit’s own circuit (issue 13)', () => {
  const ductedModels = [
    model('AH-36', 'indoor', 'air-handler'),
    model('HP-24', 'outdoor-ducted'),
    { ...model('HK-5', 'heat-kit'), heatKitKw: 5 },
  ];
  const withKit = (electrical: Record<string, unknown>) =>
    ({
      ...option,
      design: {
        zones: [{ key: 'zone-1', name: 'House', roomIds: ['r1', 'r2'], indoorUnitKey: 'AH-36' }],
        systems: [
          {
            ...(option.design as { systems: Record<string, unknown>[] }).systems[0],
            outdoorUnitKey: 'HP-24',
            heatKitKey: 'HK-5',
            electrical: {
              ...(option.design as { systems: { electrical: object }[] }).systems[0]?.electrical,
              ...electrical,
            },
          },
        ],
      },
    }) as unknown as OptionRecord;
  const show = (o: OptionRecord) =>
    render(
      <QueryClientProvider client={createQueryClient()}>
        <DesignForm jobId="j1" option={o} rooms={rooms} models={ductedModels} canEdit whys={new Map()} />
      </QueryClientProvider>,
    );

  it('not entered: the field is empty and says which run is assumed; a stored run opens unchanged', async () => {
    show(withKit({}));
    const field = await screen.findByLabelText('Panel to air handler, heat kit circuit (ft)');
    expect(field).toHaveValue('');
    expect(
      screen.getByText('Its own run for the wire and voltage drop. Empty: the outdoor unit’s 30 ft is assumed.'),
    ).toBeTruthy();
    expect(screen.getByRole('status').textContent).toBe('');
  });

  it('a stored run shows as stored, and one out of bounds is refused beside the field', async () => {
    show(withKit({ heatKitCircuitLengthFt: 85 }));
    const field = await screen.findByLabelText('Panel to air handler, heat kit circuit (ft)');
    expect(field).toHaveValue('85');
    expect(screen.getByRole('status').textContent).toBe('');
    fireEvent.change(field, { target: { value: '400' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save design' }));
    expect(await screen.findByText('Panel to air handler must be between 1 and 300 ft')).toBeTruthy();
  });
});

describe('a heat kit goes in an air handler (issue 13)', () => {
  const kit = (key: string, kw: number, fits: string[]) => ({
    ...model(key, 'heat-kit'),
    heatKitKw: kw,
    matchedKeys: fits,
  });
  const catalog = [
    model('AH-36', 'indoor', 'air-handler'),
    model('SD-12', 'indoor', 'slim-ducted'),
    model('HP-24', 'outdoor-ducted'),
    kit('HK-5', 5, ['AH-36', 'AH-60']),
    kit('HK-10', 10, ['AH-60']),
    // Listed for the system's outdoor unit (the sample option's OUT-9): its air handler takes it.
    kit('HK-OUT', 8, ['OUT-9']),
  ];
  const on = (indoorUnitKey: string) =>
    ({
      ...option,
      design: {
        ...(option.design as object),
        zones: [{ key: 'zone-1', name: 'Zone 1', roomIds: ['r1', 'r2'], indoorUnitKey }],
      },
    }) as unknown as OptionRecord;
  const show = (o: OptionRecord) =>
    render(
      <QueryClientProvider client={createQueryClient()}>
        <DesignForm jobId="j1" option={o} rooms={rooms} models={catalog} canEdit whys={new Map()} />
      </QueryClientProvider>,
    );

  it('an air handler’s system offers the kits listed for that handler or its outdoor unit only', async () => {
    show(on('AH-36'));
    const select = await screen.findByLabelText('Heat kit (backup heat)');
    const choices = [...select.querySelectorAll('option')].map((o) => o.value);
    expect(choices).toEqual(['', 'HK-5', 'HK-OUT']);
  });

  it('a slim ducted head’s system has its ducts but no heat kit to choose', async () => {
    show(on('SD-12'));
    await screen.findByLabelText('Where the ducts run');
    expect(screen.queryByLabelText('Heat kit (backup heat)')).toBeNull();
    expect(screen.getByText('Ducts', { selector: 'legend' })).toBeTruthy();
  });
});
