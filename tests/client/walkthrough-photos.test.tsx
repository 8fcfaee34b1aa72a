import { fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ConflictPanel } from '../../client/src/features/walkthrough/components/conflict-panel';
import { RoomPhotos } from '../../client/src/features/walkthrough/components/room-photos';
import { jobTarget } from '../../client/src/features/walkthrough/sync/edits';
import { useQueueState } from '../../client/src/features/walkthrough/sync/queue-context';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { createQueryClient } from '../../client/src/lib/query-client';
import { headerOf, json, mockFetch, problem } from './helpers/fetch-mock';
import {
  bedroomInput,
  designConditions,
  JOB_ID,
  jobRecord,
  renderWalkthrough,
  ROOM_ID,
  roomRecord,
  roomView,
} from './helpers/walkthrough-harness';

beforeEach(() => {
  clearCsrfToken();
});
afterEach(() => vi.unstubAllGlobals());

const photo = {
  id: 'p1',
  roomId: ROOM_ID,
  url: `/api/jobs/${JOB_ID}/rooms/${ROOM_ID}/photos/p1`,
  contentType: 'image/jpeg',
  byteSize: 10,
  width: 4,
  height: 3,
  originalName: 'wall.jpg',
  createdAt: '',
};

describe('room photos', () => {
  it('opens the rear camera, uploads the file as "file" and shows thumbnails from the photo route', async () => {
    const sent: FormData[] = [];
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`POST /api/jobs/${JOB_ID}/rooms/${ROOM_ID}/photos`]: (init) => {
        if (init?.body instanceof FormData) sent.push(init.body);
        return json(201, { photo });
      },
    });
    // The photo goes up only once the room is in the rooms cache (it exists on the server).
    const queryClient = createQueryClient();
    queryClient.setQueryData(jobKeys.rooms(JOB_ID), [roomRecord(bedroomInput, 3)]);
    const { photoQueue } = await renderWalkthrough(
      <RoomPhotos jobId={JOB_ID} room={{ ...roomView(), photos: [photo] }} />,
      { queryClient },
    );
    expect(screen.getByRole('img', { name: 'Photo 1 of 1' })).toHaveAttribute('src', photo.url);
    const input = screen.getByLabelText('Take or add a photo');
    expect(input).toHaveAttribute('accept', 'image/*');
    expect(input).toHaveAttribute('capture', 'environment');
    fireEvent.change(input, { target: { files: [new File(['x'], 'wall.jpg', { type: 'image/jpeg' })] } });
    expect(await screen.findByText('Added wall.jpg.')).toBeInTheDocument();
    expect(sent[0]?.get('file')).toBeInstanceOf(File);
    photoQueue.stop();
  });

  it('takes photos before the room has reached the server and keeps them waiting', async () => {
    const fetch = mockFetch({});
    const { photoQueue } = await renderWalkthrough(<RoomPhotos jobId={JOB_ID} room={roomView(undefined, null)} />);
    expect(screen.getByLabelText('Take or add a photo')).toBeEnabled();
    fireEvent.change(screen.getByLabelText('Take or add a photo'), {
      target: { files: [new File(['x'], 'wall.jpg', { type: 'image/jpeg' })] },
    });
    expect(
      await screen.findByText('Photos wait on this device until the room has reached the server.'),
    ).toBeInTheDocument();
    expect(screen.getByText('waiting to upload')).toBeInTheDocument();
    expect(fetch).not.toHaveBeenCalled();
    photoQueue.stop();
  });
});

function ConflictHost() {
  const state = useQueueState();
  return state.conflict ? <ConflictPanel item={state.conflict} onResolved={() => undefined} /> : <p>No conflict</p>;
}

describe('conflict on the design conditions', () => {
  it('shows both values and writes the chosen one with the new version', async () => {
    const patches: RequestInit[] = [];
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`GET /api/jobs/${JOB_ID}`]: json(200, {
        job: jobRecord({ version: 7, designConditions: { ...designConditions, outdoorCoolingDryBulbF: 99 } }),
      }),
      [`PATCH /api/jobs/${JOB_ID}`]: (init, call) => {
        patches.push(init ?? {});
        return call === 1
          ? problem(409, 'conflict', 'The job was changed by someone else.')
          : json(200, { job: jobRecord({ version: 8 }) });
      },
    });
    const { queue } = await renderWalkthrough(<ConflictHost />, { send: 'real' });
    await queue.enqueue({
      target: jobTarget(JOB_ID),
      baseVersion: 2,
      payload: { kind: 'job-update', jobId: JOB_ID, changes: { designConditions: { outdoorCoolingDryBulbF: 97 } } },
    });
    const group = await screen.findByRole('group', { name: 'Outdoor cooling dry bulb (°F)' });
    expect(group).toHaveTextContent('97');
    expect(group).toHaveTextContent('99');
    fireEvent.click(screen.getByRole('button', { name: 'Keep all mine' }));
    await waitFor(() => expect(patches).toHaveLength(2));
    expect(headerOf(patches[1], 'If-Match')).toBe('"7"');
    expect(JSON.parse(String(patches[1]?.body))).toMatchObject({ designConditions: { outdoorCoolingDryBulbF: 97 } });
  });
});
