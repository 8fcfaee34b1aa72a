import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { Suspense, type ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { DataGrid } from '../../client/src/features/price-book/components/data-grid';
import { RowPanel } from '../../client/src/features/price-book/components/row-panel';
import { gridColumns } from '../../client/src/features/price-book/model/table-view';
import { SettingsCard } from '../../client/src/features/price-book/components/settings-card';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch } from './helpers/fetch-mock';

function renderWithQuery(ui: ReactNode) {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <Suspense fallback="loading">{ui}</Suspense>
    </QueryClientProvider>,
  );
}

const row = {
  key: 'CU-38',
  version: 3,
  updatedAt: '2026-12-01T00:00:00.000Z',
  record: { key: 'CU-38', description: 'Soft copper, 3/8 in', unit: 'ft', category: 'line-sets', costCents: 135 },
};

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('price-book record panel', () => {
  it('shows calc’s message beside the cell and sends nothing while a cell is refused', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'GET /api/company-data/materials/CU-38/history': json(200, { history: [] }),
      'PUT /api/company-data/materials/CU-38': json(200, { row: { ...row, version: 4 } }),
    });
    renderWithQuery(
      <RowPanel dataset="materials" role="estimator" canEdit row={row} onClose={() => {}} onSaved={() => {}} />,
    );
    const cost = screen.getByLabelText('Cost $');
    expect(cost).toHaveValue('1.35');
    fireEvent.change(cost, { target: { value: 'cheap' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    expect(await screen.findByText('"cheap" is not an amount in dollars (e.g. 1234.50)')).toBeInTheDocument();
    expect(fetch.mock.calls.some(([, init]) => init?.method === 'PUT')).toBe(false);

    fireEvent.change(cost, { target: { value: '1.40' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));
    await screen.findByText('Saved.');
    const put = fetch.mock.calls.find(([, init]) => init?.method === 'PUT');
    expect(JSON.parse(String(put?.[1]?.body))).toEqual({ record: { ...row.record, costCents: 140, active: true } });
    expect((put?.[1]?.headers as Record<string, string>)['If-Match']).toBe('"3"');
  });

  it('an installer gets the values to read, no inputs and no cost', () => {
    mockFetch({});
    renderWithQuery(
      <RowPanel dataset="materials" role="installer" canEdit={false} row={row} onClose={() => {}} onSaved={() => {}} />,
    );
    expect(screen.getByText('Soft copper, 3/8 in')).toBeInTheDocument();
    expect(screen.queryByRole('textbox')).toBeNull();
    expect(screen.queryByText('Cost $')).toBeNull();
    expect(screen.queryByText('1.35')).toBeNull();
  });
});

describe('the materials grid', () => {
  it('shows which takeoff item a material prices, for every role that reads materials', () => {
    const priced = { ...row, record: { ...row.record, takeoffItem: 'lineset-liquid-3/8' } };
    render(
      <DataGrid
        rows={[priced]}
        columns={gridColumns('materials', 'salesperson')}
        search=""
        selectedKey={null}
        onOpen={() => {}}
        label="Materials"
      />,
    );
    const table = screen.getByRole('table', { name: 'Materials' });
    expect(within(table).getByRole('columnheader', { name: /Takeoff item/ })).toBeInTheDocument();
    expect(within(table).getByText('lineset-liquid-3/8')).toBeInTheDocument();
  });
});

describe('tax and default sell rule', () => {
  it('refuses a 100 % margin beside the field and saves a valid rule with If-Match', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'GET /api/company-data/settings': json(200, {
        settings: {
          taxRatePercent: 7.25,
          taxAppliesTo: 'materials',
          defaultSellRule: { method: 'margin', percent: 40 },
          version: 2,
        },
      }),
      'PUT /api/company-data/settings': (init) => {
        const body = JSON.parse(String(init?.body)) as { settings: Record<string, unknown> };
        return json(200, { settings: { ...body.settings, version: 3 } });
      },
    });
    renderWithQuery(<SettingsCard canEdit />);
    const percent = await screen.findByLabelText('Percent');
    fireEvent.change(percent, { target: { value: '100' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save tax and rule' }));
    expect(await screen.findByText('A margin must be below 100 %')).toBeInTheDocument();
    fireEvent.change(percent, { target: { value: '35' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save tax and rule' }));
    await waitFor(() => expect(fetch.mock.calls.some(([, init]) => init?.method === 'PUT')).toBe(true));
    const put = fetch.mock.calls.find(([, init]) => init?.method === 'PUT');
    expect(JSON.parse(String(put?.[1]?.body))).toEqual({
      settings: { taxRatePercent: 7.25, taxAppliesTo: 'materials', defaultSellRule: { method: 'margin', percent: 35 } },
    });
    expect((put?.[1]?.headers as Record<string, string>)['If-Match']).toBe('"2"');
  });
});
