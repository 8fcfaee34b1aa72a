import { act, fireEvent, screen, waitFor } from '@testing-library/react';
import { Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import WalkthroughPage from '../../client/src/app/routes/job-walkthrough';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { createQueryClient } from '../../client/src/lib/query-client';
import { bedroomInput, JOB_ID, jobRecord, renderWalkthrough, roomRecord } from './helpers/walkthrough-harness';

afterEach(() => vi.unstubAllGlobals());

/**
 * The answer to a room's create lands while the person is already typing in the new room.
 * Two stores change then: the queue drops the create, the query cache gains the room. The
 * editor must stay the same element throughout (a remount loses focus and the keystrokes
 * that were on their way), and must never show another room in between.
 */
describe('a new room whose create is answered while its name is being typed', () => {
  it('keeps the same editor, the focus and the typed name, and saves the name', async () => {
    const answers: Array<() => void> = [];
    const sent: Array<{ method: string; url: string; body: unknown }> = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
        const url = String(input);
        const method = init?.method ?? 'GET';
        if (url === '/api/auth/csrf') return Response.json({ token: 't' });
        const body: unknown = typeof init?.body === 'string' ? JSON.parse(init.body) : null;
        sent.push({ method, url, body });
        const {
          id,
          position,
          input: roomInput,
        } = (body ?? {}) as { id?: string; position?: number; input?: Record<string, unknown> };
        if (method === 'POST') {
          // Held until the test lets it through, so the answer lands mid-typing.
          await new Promise<void>((resolve) => answers.push(resolve));
          return Response.json(
            { room: { ...roomRecord(roomInput ?? {}, 1), id, position } },
            { status: 201, headers: { ETag: '"1"' } },
          );
        }
        if (method === 'PATCH') {
          const roomId = url.split('/').pop() ?? '';
          return Response.json(
            { room: { ...roomRecord(roomInput ?? {}, 2), id: roomId, position: 1 } },
            { headers: { ETag: '"2"' } },
          );
        }
        throw new Error(`Unexpected fetch: ${method} ${url}`);
      }),
    );
    const queryClient = createQueryClient();
    queryClient.setQueryData(jobKeys.detail(JOB_ID), jobRecord());
    queryClient.setQueryData(jobKeys.rooms(JOB_ID), [roomRecord(bedroomInput, 3)]);
    queryClient.setQueryData(jobKeys.settings(), {
      unitSystem: 'imperial',
      defaultDesignConditions: null,
      version: 1,
      updatedAt: null,
    });
    await renderWalkthrough(
      <Routes>
        <Route path="/jobs/:jobId" element={<WalkthroughPage />} />
      </Routes>,
      { send: 'real', queryClient, path: `/jobs/${JOB_ID}` },
    );

    fireEvent.click(await screen.findByRole('button', { name: 'Copy room' }));
    const nameField = await screen.findByDisplayValue('Bedroom 2 (copy)');
    // Every value the name field shows from here on, and whether it is still the same element.
    const shown: string[] = [];
    const seen = new Set<Element>();
    const watch = () => {
      const field = screen.getByLabelText('Room name');
      seen.add(field);
      shown.push((field as HTMLInputElement).value);
    };
    const observer = new MutationObserver(watch);
    observer.observe(document.body, { subtree: true, childList: true, attributes: true });
    nameField.focus();
    fireEvent.change(nameField, { target: { value: 'Bedroom west' } });
    await waitFor(() => expect(answers).toHaveLength(1));
    await act(async () => {
      answers[0]?.();
      await new Promise((r) => setTimeout(r, 50));
    });
    watch();
    observer.disconnect();

    expect(screen.getByLabelText('Room name')).toBe(nameField);
    expect(document.activeElement).toBe(nameField);
    expect(seen.size).toBe(1);
    expect(shown.every((v) => v === 'Bedroom west')).toBe(true);
    await waitFor(() => expect(sent.filter((s) => s.method === 'PATCH')).toHaveLength(1), { timeout: 3000 });
    expect(sent.find((s) => s.method === 'PATCH')?.body).toMatchObject({ input: { name: 'Bedroom west' } });
  });
});
