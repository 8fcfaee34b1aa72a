import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from '../../client/src/features/auth/components/sign-in-form';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const user = {
  id: 'u1',
  name: 'Test Owner',
  email: 'owner@example.com',
  role: 'owner',
  active: true,
  companyId: 'c1',
  createdAt: '2026-01-01T00:00:00.000Z',
};

function renderSignIn(onSignedIn = vi.fn(), email = 'owner@example.com', password = 'not the password') {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <SignInForm onSignedIn={onSignedIn} />
    </QueryClientProvider>,
  );
  fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: email } });
  fireEvent.change(screen.getByLabelText('Password'), { target: { value: password } });
  fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
  return onSignedIn;
}

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('sign-in form', () => {
  it('shows the server’s 401 message', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/auth/login': problem(401, 'unauthenticated', 'The e-mail or password is not right.'),
    });
    const onSignedIn = renderSignIn();
    expect(await screen.findByRole('alert')).toHaveTextContent('The e-mail or password is not right.');
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('checks the contract’s sign-in rules before sending anything', async () => {
    const fetch = mockFetch({});
    const onSignedIn = renderSignIn(vi.fn(), 'owner at example', '');
    // The words are the contract's emailRule and signInPasswordRule messages.
    expect(await screen.findByText('Enter a valid e-mail address.')).toBeInTheDocument();
    expect(screen.getByText('Enter your password.')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByLabelText('E-mail')).toHaveFocus();
    expect(screen.getByRole('alert')).toHaveTextContent('Check the highlighted fields.');
    expect(fetch).not.toHaveBeenCalled();
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('puts a 400’s field errors on their fields', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/auth/login': problem(400, 'validation', 'Some fields need attention.', {
        errors: [{ path: 'email', message: 'The server refused this address.' }],
      }),
    });
    renderSignIn();
    expect(await screen.findByText('The server refused this address.')).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('alert')).toHaveTextContent('Check the highlighted fields.');
  });

  it('says how long to wait after a 429 and holds the button', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/auth/login': problem(429, 'rate-limited', 'Too many attempts.', {}, { 'Retry-After': '30' }),
    });
    renderSignIn();
    expect(await screen.findByText('Too many sign-in attempts')).toBeInTheDocument();
    expect(screen.getByRole('alert')).toHaveTextContent(/Try again in 30 seconds/);
    expect(screen.getByRole('button', { name: 'Sign in' })).toBeDisabled();
  });

  it('signs in, loads the session and hands over', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/auth/login': json(200, { user }),
      'GET /api/auth/session': json(200, {
        me: { user, company: { id: 'c1', name: 'Test Company', unitSystem: 'imperial' } },
      }),
    });
    const onSignedIn = renderSignIn();
    await vi.waitFor(() => expect(onSignedIn).toHaveBeenCalled());
    expect(fetch.mock.calls.map(([url, init]) => `${init?.method} ${String(url)}`)).toEqual([
      'GET /api/auth/csrf',
      'POST /api/auth/login',
      'GET /api/auth/session',
    ]);
  });
});
