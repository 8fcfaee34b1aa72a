import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { RESET_LINK_INVALID } from '@contract';
import { ResetPasswordForm } from '../../client/src/features/auth/components/reset-password-form';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const TOKEN = 'A'.repeat(40) + '_-9';

function renderAt(hash: string) {
  window.history.replaceState(null, '', `/reset-password${hash}`);
  render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter>
        <ResetPasswordForm />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

function submit(password: string, again = password) {
  fireEvent.change(screen.getByLabelText('New password'), { target: { value: password } });
  fireEvent.change(screen.getByLabelText('New password again'), { target: { value: again } });
  fireEvent.click(screen.getByRole('button', { name: 'Set new password' }));
}

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('reset-password page', () => {
  it('reads the token from the fragment, takes it out of the address bar and sends it with the password', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/auth/password-reset/complete': json(200, { message: 'Your new password is set. Sign in with it.' }),
    });
    renderAt(`#token=${TOKEN}`);
    expect(window.location.hash).toBe('');
    expect(window.location.pathname).toBe('/reset-password');
    submit('a-new-long-password');
    expect(await screen.findByText('Your new password is set.')).toBeInTheDocument();
    const call = fetch.mock.calls.find(([url]) => String(url) === '/api/auth/password-reset/complete');
    expect(JSON.parse(String(call?.[1]?.body))).toEqual({ token: TOKEN, password: 'a-new-long-password' });
  });

  it('checks the bounds and the second typing before sending anything', async () => {
    const fetch = mockFetch({ 'GET /api/auth/csrf': json(200, { token: 't' }) });
    renderAt(`#token=${TOKEN}`);
    submit('short', 'other');
    expect(await screen.findByText('Password must be at least 12 characters.')).toBeInTheDocument();
    expect(screen.getByText('The two new passwords are not the same.')).toBeInTheDocument();
    expect(fetch.mock.calls.some(([url]) => String(url).includes('password-reset'))).toBe(false);
  });

  it('shows the server’s words for a used or expired link, with a way to ask again', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/auth/password-reset/complete': problem(400, 'bad-request', RESET_LINK_INVALID),
    });
    renderAt(`#token=${TOKEN}`);
    submit('a-new-long-password');
    expect(await screen.findByRole('alert')).toHaveTextContent(RESET_LINK_INVALID);
    expect(screen.getByRole('link', { name: 'Ask for a new link' })).toHaveAttribute('href', '/forgot-password');
  });

  it('without a token, says the page needs the e-mail’s link', () => {
    renderAt('');
    expect(screen.getByText('This page needs the link from the e-mail')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Set new password' })).toBeNull();
  });
});
