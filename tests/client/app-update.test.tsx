import { act, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { API_VERSION } from '../../server/src/contract/api-version';
import { apiFetch, clearCsrfToken } from '../../client/src/lib/api-client';
import { AppUpdateBanner, offerUpdate } from '../../client/src/lib/offline/app-update';
import { json, mockFetch } from './helpers/fetch-mock';

afterEach(() => {
  vi.unstubAllGlobals();
  clearCsrfToken();
});

describe('a new version of the app', () => {
  // Runs first: the API-version test below leaves the page marked as older than the server.
  it('is offered, never forced: "Later" keeps this page; "Reload now" applies it', () => {
    const apply = vi.fn(async () => undefined);
    render(<AppUpdateBanner />);
    expect(screen.queryByText('A new version of Gaugeline is ready.')).toBeNull();
    act(() => offerUpdate(apply));
    expect(screen.getByText('A new version of Gaugeline is ready.')).toBeInTheDocument();
    expect(apply).not.toHaveBeenCalled();
    fireEvent.click(screen.getByRole('button', { name: 'Reload now' }));
    expect(apply).toHaveBeenCalledWith(true);
    fireEvent.click(screen.getByRole('button', { name: 'Later' }));
    expect(screen.queryByText('A new version of Gaugeline is ready.')).toBeNull();
  });
});

describe('a page older than the server', () => {
  it('sends its API version and, when the server names another, asks for a reload instead of carrying on', async () => {
    const fetch = mockFetch({
      'GET /api/jobs': json(200, { items: [] }, { 'X-Gaugeline-Api': String(API_VERSION) }),
      'GET /api/staff': json(200, { staff: [] }, { 'X-Gaugeline-Api': String(API_VERSION + 1) }),
    });
    render(<AppUpdateBanner />);
    await apiFetch('/api/jobs');
    const init = fetch.mock.calls[0]?.[1];
    expect(new Headers(init?.headers).get('X-Gaugeline-Api')).toBe(String(API_VERSION));
    expect(screen.queryByRole('alert')).toBeNull();
    await apiFetch('/api/staff');
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'Gaugeline was updated on the server. Reload to carry on — changes waiting on this device are kept',
    );
    expect(screen.getByRole('button', { name: 'Reload now' })).toBeInTheDocument();
    // Not something to put off: there is no "Later" while the versions differ.
    expect(screen.queryByRole('button', { name: 'Later' })).toBeNull();
  });
});
