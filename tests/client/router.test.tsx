import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createRoutes } from '../../client/src/app/router';
import type { Role } from '@contract';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const company = { id: 'c1', name: 'Test Heating Co', unitSystem: 'imperial' };
const person = (role: Role, name = 'Pat Tester') => ({
  id: `u-${role}`,
  name,
  email: `${role}@example.com`,
  role,
  active: true,
  companyId: 'c1',
  createdAt: '2026-01-01T00:00:00.000Z',
});

function renderAt(url: string) {
  const queryClient = createQueryClient();
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [url] });
  render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  );
  return router;
}

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('routing and guards', () => {
  it('sends a signed-out visitor to sign-in, remembering the page', async () => {
    mockFetch({ 'GET /api/auth/session': json(200, { me: null }) });
    const router = renderAt('/users');
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?next=%2Fusers');
  });

  it('sends a role without access back home with a notice', async () => {
    mockFetch({ 'GET /api/auth/session': json(200, { me: { user: person('salesperson'), company } }) });
    const router = renderAt('/users');
    expect(await screen.findByText('That page is not part of your role')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/');
    expect(screen.getByRole('heading', { name: 'Hello, Pat' })).toBeInTheDocument();
  });

  it('shows the owner the shell, the user list and no Outbox when the server has none', async () => {
    mockFetch({
      'GET /api/auth/session': json(200, { me: { user: person('owner', 'Robin Owner'), company } }),
      'GET /api/users': json(200, { users: [person('owner', 'Robin Owner'), person('installer', 'Sam Fitter')] }),
      'GET /api/dev/outbox': problem(404, 'not-found', 'The outbox was not found.'),
    });
    renderAt('/users');
    expect(await screen.findByText('Sam Fitter')).toBeInTheDocument();
    expect(screen.getByTestId('user-name')).toHaveTextContent('Robin Owner');
    expect(screen.getByRole('button', { name: 'Sign out' })).toBeInTheDocument();
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { name: 'Users' })).toHaveAttribute('aria-current', 'page');
    expect(within(nav).queryByRole('link', { name: 'Outbox' })).toBeNull();
    expect(screen.getByText('This is you. Another owner can change your role.')).toBeInTheDocument();
  });

  it.each([
    ['/sign-in?next=%2Fusers', '/users'],
    ['/sign-in?next=%2F%2Felsewhere.example%2F', '/'],
  ])('after sign-in at %s goes to %s', async (start, target) => {
    let signedIn = false;
    const me = { user: person('owner'), company };
    mockFetch({
      'GET /api/auth/session': () => json(200, { me: signedIn ? me : null }),
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/auth/login': () => {
        signedIn = true;
        return json(200, { user: me.user });
      },
      'GET /api/users': json(200, { users: [me.user] }),
      'GET /api/dev/outbox': json(200, { messages: [] }),
    });
    const router = renderAt(start);
    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: 'owner@example.com' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'a password' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await screen.findByTestId('user-name');
    await waitFor(() => expect(router.state.location.pathname).toBe(target));
    expect(
      await within(screen.getByRole('navigation', { name: 'Main' })).findByRole('link', { name: 'Outbox' }),
    ).toBeInTheDocument();
  });

  it('renders the not-found page inside the shell', async () => {
    mockFetch({ 'GET /api/auth/session': json(200, { me: { user: person('installer'), company } }) });
    renderAt('/no-such-page');
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeInTheDocument();
    expect(screen.getByRole('navigation', { name: 'Main' })).toBeInTheDocument();
  });

  it('explains a switched-off outbox', async () => {
    mockFetch({
      'GET /api/auth/session': json(200, { me: { user: person('owner'), company } }),
      'GET /api/dev/outbox': problem(404, 'not-found', 'The outbox was not found.'),
    });
    renderAt('/dev/outbox');
    expect(await screen.findByText('The outbox is off on this server')).toBeInTheDocument();
  });
});
