import { useQuery } from '@tanstack/react-query';
import { act, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { LiveSaveStatus } from '../../client/src/features/walkthrough/components/live-save-status';
import { RoomPhotos } from '../../client/src/features/walkthrough/components/room-photos';
import { roomTarget } from '../../client/src/features/walkthrough/sync/edits';
import { overlayRooms } from '../../client/src/features/walkthrough/sync/overlay';
import { memoryFileStorage } from '../../client/src/lib/offline/file-storage';
import { useQueueState } from '../../client/src/features/walkthrough/sync/queue-context';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import type { RoomRecord } from '@contract';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';
import { bedroomInput, JOB_ID, renderWalkthrough, ROOM_ID, roomRecord } from './helpers/walkthrough-harness';

const PHOTOS = `POST /api/jobs/${JOB_ID}/rooms/${ROOM_ID}/photos`;
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

/** Both queues listen to window 'online': stop them so one test's queue never answers the next test's event. */
const started: { stop(): void }[] = [];
beforeEach(() => {
  clearCsrfToken();
});
afterEach(() => {
  for (const q of started.splice(0)) q.stop();
  vi.unstubAllGlobals();
});

/** The room as the walk-through shows it: the rooms cache with the edit queue laid over it. */
function Room() {
  const rooms =
    useQuery({ queryKey: jobKeys.rooms(JOB_ID), queryFn: (): RoomRecord[] => [], staleTime: Infinity }).data ?? [];
  const { items } = useQueueState();
  const room = overlayRooms(JOB_ID, rooms, items).find((r) => r.id === ROOM_ID);
  return (
    <>
      <LiveSaveStatus />
      {room ? <RoomPhotos jobId={JOB_ID} room={room} /> : <p>No room</p>}
    </>
  );
}

function clientWith(rooms: RoomRecord[]) {
  const queryClient = createQueryClient();
  queryClient.setQueryData(jobKeys.rooms(JOB_ID), rooms);
  return queryClient;
}

async function renderRoom(options: Parameters<typeof renderWalkthrough>[1], photoStorage = memoryFileStorage()) {
  const view = await renderWalkthrough(<Room />, { ...options, photoStorage });
  started.push(view.photoQueue, view.queue);
  return { ...view, photoStorage };
}

const pill = () => screen.getAllByRole('status').find((s) => /Saved|Saving|Offline/.test(s.textContent ?? ''));
const addPhoto = (name = 'wall.jpg', type = 'image/jpeg') =>
  fireEvent.change(screen.getByLabelText('Take or add a photo'), {
    target: { files: [new File(['x'], name, { type })] },
  });

describe('photos kept on the device', () => {
  it('takes a photo offline, shows it waiting, and uploads it when the connection returns', async () => {
    const fetch = mockFetch({ 'GET /api/auth/csrf': json(200, { token: 't' }), [PHOTOS]: json(201, { photo }) });
    let online = false;
    const { photoStorage } = await renderRoom({
      online: () => online,
      queryClient: clientWith([roomRecord(bedroomInput, 3)]),
    });
    const input = screen.getByLabelText('Take or add a photo');
    expect(input).toBeEnabled();
    addPhoto();
    expect(await screen.findByRole('img', { name: 'wall.jpg, waiting to upload' })).toHaveAttribute(
      'src',
      expect.stringMatching(/^blob:/),
    );
    expect(screen.getByText('waiting to upload')).toBeInTheDocument();
    expect(pill()).toHaveTextContent('Offline — 1 change waiting');
    expect(fetch).not.toHaveBeenCalled();

    online = true;
    window.dispatchEvent(new Event('online'));
    expect(await screen.findByRole('img', { name: 'Photo 1 of 1' })).toHaveAttribute('src', photo.url);
    expect(screen.queryByText('waiting to upload')).not.toBeInTheDocument();
    expect(screen.getByText('Added wall.jpg.')).toBeInTheDocument();
    expect(pill()).toHaveTextContent('Saved');
    const sent = fetch.mock.calls.find(([url]) => String(url).endsWith('/photos'))?.[1]?.body;
    expect(sent instanceof FormData ? sent.get('file') : null).toBeInstanceOf(File);
    expect(photoStorage.ids()).toEqual([]);
  });

  it('holds a photo for a room not yet on the server until its create has been sent', async () => {
    const order: string[] = [];
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`POST /api/jobs/${JOB_ID}/rooms`]: () => (order.push('room'), json(201, { room: roomRecord(bedroomInput, 1) })),
      [PHOTOS]: () => (order.push('photo'), json(201, { photo })),
    });
    let online = false;
    const { queue } = await renderRoom({ online: () => online, send: 'real', queryClient: clientWith([]) });
    await queue.enqueue({
      target: roomTarget(ROOM_ID),
      baseVersion: null,
      payload: { kind: 'room-create', jobId: JOB_ID, roomId: ROOM_ID, position: 0, input: bedroomInput },
    });
    addPhoto();
    expect(
      await screen.findByText('Photos wait on this device until the room has reached the server.'),
    ).toBeInTheDocument();
    expect(pill()).toHaveTextContent('Offline — 2 changes waiting');

    online = true;
    window.dispatchEvent(new Event('online'));
    expect(await screen.findByRole('img', { name: 'Photo 1 of 1' })).toBeInTheDocument();
    expect(order).toEqual(['room', 'photo']);
  });

  it('removes a photo the server refuses and says why next to the photos', async () => {
    const detail =
      'This file is not a JPEG, PNG or WebP photo (its content was checked, not its name). Upload a photo in one of those formats.';
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [PHOTOS]: problem(415, 'unsupported-media-type', detail),
    });
    const { photoStorage } = await renderRoom({ queryClient: clientWith([roomRecord(bedroomInput, 3)]) });
    addPhoto('notes.pdf', 'image/jpeg');
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('notes.pdf was not added.');
    expect(alert).toHaveTextContent(detail);
    expect(photoStorage.ids()).toEqual([]);
    expect(screen.queryByText('waiting to upload')).not.toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Dismiss' }));
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('sends a photo whose room is gone from the server and tells the 404 instead of waiting for ever', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [PHOTOS]: problem(404, 'not-found', 'The room was not found.'),
    });
    let online = false;
    const { photoQueue, photoStorage, queryClient } = await renderRoom({
      online: () => online,
      queryClient: clientWith([roomRecord(bedroomInput, 3)]),
    });
    addPhoto();
    await waitFor(() => expect(photoStorage.ids()).toHaveLength(1));
    // Deleted on another device: the next rooms list no longer has it.
    online = true;
    act(() => queryClient.setQueryData(jobKeys.rooms(JOB_ID), []));
    await waitFor(() => expect(photoStorage.ids()).toEqual([]));
    expect(photoQueue.getSnapshot().notices).toMatchObject([
      { kind: 'refused', fileName: 'wall.jpg', message: 'The room was not found.' },
    ]);
  });

  it('keeps a photo after a server error and tries it again', async () => {
    let calls = 0;
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [PHOTOS]: () => (++calls === 1 ? problem(503, 'unavailable', 'Down') : json(201, { photo })),
    });
    const { photoQueue, photoStorage } = await renderRoom({ queryClient: clientWith([roomRecord(bedroomInput, 3)]) });
    addPhoto();
    await waitFor(() => expect(calls).toBe(1));
    await waitFor(() => expect(photoQueue.getSnapshot().uploading).toBeNull());
    expect(photoStorage.ids()).toHaveLength(1);
    expect(screen.getByText('waiting to upload')).toBeInTheDocument();
    // What the 15-second retry does.
    await photoQueue.flush();
    expect(await screen.findByRole('img', { name: 'Photo 1 of 1' })).toBeInTheDocument();
    expect(photoStorage.ids()).toEqual([]);
  });

  it('keeps waiting photos across a reload and uploads them in order afterwards', async () => {
    const names: string[] = [];
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [PHOTOS]: (init) => {
        const file = init?.body instanceof FormData ? init.body.get('file') : null;
        names.push(file instanceof File ? file.name : '?');
        return json(201, { photo: { ...photo, id: `p${names.length}` } });
      },
    });
    let online = false;
    const photoStorage = memoryFileStorage();
    const first = await renderRoom(
      { online: () => online, queryClient: clientWith([roomRecord(bedroomInput, 3)]) },
      photoStorage,
    );
    addPhoto('first.jpg');
    addPhoto('second.jpg');
    await waitFor(() => expect(photoStorage.ids()).toHaveLength(2));
    first.photoQueue.stop();
    first.queue.stop();
    first.unmount();

    // A new page: a new queue over the same storage.
    await renderRoom({ online: () => online, queryClient: clientWith([roomRecord(bedroomInput, 3)]) }, photoStorage);
    expect(screen.getAllByText('waiting to upload')).toHaveLength(2);
    expect(pill()).toHaveTextContent('Offline — 2 changes waiting');
    online = true;
    window.dispatchEvent(new Event('online'));
    await waitFor(() => expect(screen.getAllByRole('img', { name: /^Photo \d of 2$/ })).toHaveLength(2));
    expect(names).toEqual(['first.jpg', 'second.jpg']);
    expect(photoStorage.ids()).toEqual([]);
  });
});
