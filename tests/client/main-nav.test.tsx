import { render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { MainNav } from '../../client/src/components/layout/main-nav';
import type { Feature } from '../../client/src/config/nav';
import type { Role } from '@contract';

function navLinks(role: Role, features: Feature[] = []) {
  render(
    <MemoryRouter>
      <MainNav role={role} features={new Set(features)} />
    </MemoryRouter>,
  );
  const nav = screen.getByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((a) => [a.textContent, a.getAttribute('href')]);
}

describe('main navigation by role', () => {
  it('gives the owner every area, with the outbox only when the server has one', () => {
    const owner = [
      ['Jobs', '/jobs'],
      ['Users', '/users'],
      ['E-mail', '/mail'],
      ['Reports', '/reports'],
      ['Settings', '/settings'],
      ['Price book & catalog', '/price-book'],
      ['Your account', '/account'],
    ];
    expect(navLinks('owner')).toEqual(owner);
  });

  it('adds Outbox for the owner when available', () => {
    expect(navLinks('owner', ['outbox']).map(([label]) => label)).toContain('Outbox');
  });

  it.each<Role>(['estimator', 'salesperson', 'installer'])(
    'shows Jobs, the catalog (read-only outside the office) and their account to the %s',
    (role) => {
      expect(navLinks(role, ['outbox'])).toEqual([
        ['Jobs', '/jobs'],
        ['Price book & catalog', '/price-book'],
        ['Your account', '/account'],
      ]);
    },
  );
});
