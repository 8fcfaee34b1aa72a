import { ftFromM } from '@calc';
import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { DesignConditionsForm } from '../../client/src/features/walkthrough/components/design-conditions-form';
import { RoomEditor } from '../../client/src/features/walkthrough/components/room-editor';
import { SaveStatusPill, saveStatus } from '../../client/src/lib/offline/save-status-pill';
import { UnitSystemContext } from '../../client/src/features/walkthrough/components/unit-system';
import { designConditions, JOB_ID, jobRecord, renderWalkthrough, roomView } from './helpers/walkthrough-harness';
import { render } from '@testing-library/react';

const companyDefaults = { ...designConditions };
const job = jobRecord({
  designConditions: { ...designConditions, outdoorHeatingDryBulbF: 15 },
  designSources: {
    outdoorCoolingDryBulbF: { source: 'company-default', note: '' },
    outdoorHeatingDryBulbF: { source: 'entered', note: 'County code table' },
  },
});
const hintOf = (label: string) => document.getElementById(`${screen.getByLabelText(label).id}-hint`)?.textContent;

describe('design conditions', () => {
  it('prefills company defaults, says where each value came from, and states where design values must come from', async () => {
    await renderWalkthrough(<DesignConditionsForm job={job} companyDefaults={companyDefaults} />);
    expect(
      screen.getByText(/must come from the local code’s climate table or a recognised climatic data source/),
    ).toBeInTheDocument();
    expect(screen.getByLabelText('Outdoor cooling dry bulb')).toHaveValue('95');
    expect(hintOf('Outdoor cooling dry bulb')).toBe('Source: Company default');
    expect(screen.getByLabelText('Outdoor heating dry bulb')).toHaveValue('15');
    expect(hintOf('Outdoor heating dry bulb')).toBe('Source: Entered for this job');
    expect(screen.getByLabelText('Where outdoor heating dry bulb came from')).toHaveValue('County code table');
  });

  it('marks a typed value as entered, saves only entered values with their notes, and can go back to the default', async () => {
    const { queue } = await renderWalkthrough(<DesignConditionsForm job={job} companyDefaults={companyDefaults} />, {
      online: () => false,
    });
    fireEvent.change(screen.getByLabelText('Outdoor cooling dry bulb'), { target: { value: '97' } });
    expect(hintOf('Outdoor cooling dry bulb')).toBe('Source: Entered for this job');
    await waitFor(() => expect(queue.getSnapshot().items).toHaveLength(1), { timeout: 5000 });
    expect(queue.getSnapshot().items[0]).toMatchObject({
      baseVersion: 2,
      payload: {
        kind: 'job-update',
        jobId: JOB_ID,
        changes: {
          designConditions: { outdoorCoolingDryBulbF: 97, outdoorHeatingDryBulbF: 15 },
          designSourceNotes: { outdoorHeatingDryBulbF: 'County code table' },
          tightness: 'average',
        },
      },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Use company default for outdoor cooling dry bulb' }));
    expect(screen.getByLabelText('Outdoor cooling dry bulb')).toHaveValue('95');
    expect(hintOf('Outdoor cooling dry bulb')).toBe('Source: Company default');
  });

  it('shows calc’s rule next to the field', async () => {
    await renderWalkthrough(<DesignConditionsForm job={job} companyDefaults={companyDefaults} />);
    fireEvent.change(screen.getByLabelText('Outdoor heating dry bulb'), { target: { value: '70' } });
    expect(
      await screen.findByText('Outdoor heating design temperature must be below the indoor heating set point'),
    ).toBeInTheDocument();
  });
});

describe('metric companies', () => {
  it('shows and takes metric, and stores calc’s imperial', async () => {
    const { queue } = await renderWalkthrough(
      <UnitSystemContext.Provider value="metric">
        <RoomEditor jobId={JOB_ID} room={roomView()} designConditions={designConditions} tightness="average" />
      </UnitSystemContext.Provider>,
      { online: () => false },
    );
    const length = screen.getByLabelText('Length');
    expect(length).toHaveValue('3.66');
    expect(document.getElementById(`${length.id}-unit`)).toHaveTextContent('m');
    fireEvent.change(length, { target: { value: '4' } });
    await waitFor(() => expect(queue.getSnapshot().items).toHaveLength(1), { timeout: 5000 });
    expect(queue.getSnapshot().items[0]?.payload).toMatchObject({ input: { lengthFt: ftFromM({ m: 4 }) } });
    expect(length).toHaveValue('4');
  });
});

describe('signed out while saving', () => {
  it('keeps the changes and says so', () => {
    const item = { id: 'e1', seq: 1, target: 'room:a', baseVersion: 1, payload: {}, queuedAt: '' };
    const status = saveStatus(
      { items: [item], online: true, sending: false, conflict: null, blocked: 'Session ended' },
      0,
    );
    render(<SaveStatusPill status={status} />);
    expect(screen.getByRole('status')).toHaveTextContent('Not saved — sign in again; 1 change kept');
  });
});
