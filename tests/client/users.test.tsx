import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { Suspense, type ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { CreateUserForm } from '../../client/src/features/users/components/create-user-form';
import { UsersTable } from '../../client/src/features/users/components/users-table';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const person = (id: string, name: string, role: string, active = true) => ({
  id,
  name,
  email: `${id}@example.com`,
  role,
  active,
  companyId: 'c1',
  createdAt: '2026-01-01T00:00:00.000Z',
});

function renderWithQuery(ui: ReactNode) {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <Suspense fallback="loading">{ui}</Suspense>
    </QueryClientProvider>,
  );
}

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('users page parts', () => {
  it('shows a refused role change beside the person', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'GET /api/users': json(200, { users: [person('me', 'Me Owner', 'owner'), person('o2', 'Other Owner', 'owner')] }),
      'PATCH /api/users/o2': problem(422, 'unprocessable', 'A company needs at least one active owner.'),
    });
    renderWithQuery(<UsersTable currentUserId="me" />);
    const select = await screen.findByLabelText('Role for Other Owner');
    expect(screen.getByLabelText('Role for Me Owner')).toBeDisabled();
    fireEvent.change(select, { target: { value: 'installer' } });
    expect(await screen.findByRole('alert')).toHaveTextContent('A company needs at least one active owner.');
  });

  it('asks before deactivating', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'GET /api/users': json(200, {
        users: [person('me', 'Me Owner', 'owner'), person('i1', 'Ivy Installer', 'installer')],
      }),
      'PATCH /api/users/i1': json(200, { user: person('i1', 'Ivy Installer', 'installer', false) }),
    });
    renderWithQuery(<UsersTable currentUserId="me" />);
    const row = (await screen.findByText('Ivy Installer')).closest('tr');
    if (!row) throw new Error('no row');
    fireEvent.click(within(row).getByRole('button', { name: 'Deactivate' }));
    expect(fetch.mock.calls.some(([, init]) => init?.method === 'PATCH')).toBe(false);
    fireEvent.click(within(row).getByRole('button', { name: 'Deactivate Ivy Installer' }));
    await waitFor(() =>
      expect(fetch.mock.calls.find(([, init]) => init?.method === 'PATCH')?.[1]?.body).toBe('{"active":false}'),
    );
  });

  it('puts a taken e-mail (409) under the E-mail field', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/users': problem(409, 'conflict', 'That e-mail address already has an account.'),
    });
    renderWithQuery(<CreateUserForm />);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'New Person' } });
    fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: 'taken@example.com' } });
    fireEvent.change(screen.getByLabelText('First password'), { target: { value: 'twelve chars or more' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add user' }));
    await waitFor(() =>
      expect(screen.getByLabelText('E-mail')).toHaveAccessibleDescription(
        'That e-mail address already has an account.',
      ),
    );
  });
});
