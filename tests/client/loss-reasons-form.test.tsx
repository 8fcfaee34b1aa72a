import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { Suspense } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { CANCELLED_BY_BUYER, type LossReasonsRecord } from '@contract';
import { LossReasonsForm } from '../../client/src/features/company-settings/components/loss-reasons-form';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { headerOf, json, mockFetch, problem } from './helpers/fetch-mock';

/** Issue 14: the owner's list of loss reasons in the company settings, against a stand-in server. */
const PATH = '/api/company/loss-reasons';

function record(reasons: string[], version = 3): LossReasonsRecord {
  return { reasons, systemReason: CANCELLED_BY_BUYER, isDefault: version === 0, version };
}

function renderForm(list: LossReasonsRecord) {
  const client = createQueryClient();
  client.setQueryData(jobKeys.lossReasons(), list);
  render(
    <QueryClientProvider client={client}>
      <Suspense fallback="loading">
        <LossReasonsForm />
      </Suspense>
    </QueryClientProvider>,
  );
  return client;
}

const rows = () => screen.getAllByLabelText(/^Reason \d+$/) as HTMLInputElement[];
const values = () => rows().map((r) => r.value);
const puts = (fetch: ReturnType<typeof mockFetch>) => fetch.mock.calls.filter(([, init]) => init?.method === 'PUT');
const saveList = () => fireEvent.click(screen.getByRole('button', { name: 'Save the list' }));

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('the loss reasons list', () => {
  it('renames, reorders, removes and adds; the PUT carries the list in order with If-Match, and “Saved” once the server answered', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`PUT ${PATH}`]: (init) => {
        const body = JSON.parse(String(init?.body)) as { reasons: string[] };
        return json(200, { lossReasons: record(body.reasons, 4) }, { ETag: '"4"' });
      },
    });
    const client = renderForm(record(['Price too high', 'Went with another contractor', 'Financing not approved']));
    expect(values()).toEqual(['Price too high', 'Went with another contractor', 'Financing not approved']);
    // The system's reason is shown, not editable.
    expect(screen.getByText(CANCELLED_BY_BUYER)).toBeInTheDocument();
    expect(screen.queryByDisplayValue(CANCELLED_BY_BUYER)).toBeNull();

    fireEvent.change(rows()[0]!, { target: { value: 'Price above the budget' } });
    fireEvent.click(screen.getByRole('button', { name: 'Move reason 3 up' }));
    expect(values()).toEqual(['Price above the budget', 'Financing not approved', 'Went with another contractor']);
    expect(screen.getByRole('status')).toHaveTextContent('“Financing not approved” moved to place 2 of 3.');
    fireEvent.click(screen.getByRole('button', { name: 'Remove reason 3' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add a reason' }));
    fireEvent.change(rows()[2]!, { target: { value: 'Moving house' } });
    expect(screen.getByText('Changes not saved yet.')).toBeInTheDocument();

    saveList();
    await screen.findByText('Saved. “Mark lost” offers this list, in this order, from now on.');
    const [call] = puts(fetch);
    expect(JSON.parse(String(call?.[1]?.body))).toEqual({
      reasons: ['Price above the budget', 'Financing not approved', 'Moving house'],
    });
    expect(headerOf(call?.[1], 'If-Match')).toBe('"3"');
    // The cached list every "Mark lost" reads is the server's answer.
    expect(client.getQueryData<LossReasonsRecord>(jobKeys.lossReasons())?.version).toBe(4);
    expect(values()).toEqual(['Price above the budget', 'Financing not approved', 'Moving house']);
  });

  it('says beside the reason what is wrong (empty, the system’s words, twice, too long) and sends nothing', async () => {
    const fetch = mockFetch({});
    renderForm(record(['Price too high', 'Financing not approved']));
    fireEvent.click(screen.getByRole('button', { name: 'Add a reason' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add a reason' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add a reason' }));
    fireEvent.change(rows()[1]!, { target: { value: 'cancelled BY buyer ' } });
    fireEvent.change(rows()[2]!, { target: { value: 'price too high' } });
    fireEvent.change(rows()[3]!, { target: { value: 'x'.repeat(81) } });
    saveList();
    const form = screen.getByRole('form', { name: 'Loss reasons' });
    const items = await within(form).findAllByRole('listitem');
    await waitFor(() =>
      expect(items[1]).toHaveTextContent(
        `“${CANCELLED_BY_BUYER}” is kept for cancellations the system records; choose other words.`,
      ),
    );
    expect(items[2]).toHaveTextContent('“price too high” is on the list twice.');
    expect(items[3]).toHaveTextContent('A reason is at most 80 characters.');
    expect(items[4]).toHaveTextContent('A reason cannot be empty.');
    expect(rows()[1]).toHaveAttribute('aria-invalid', 'true');
    expect(items[0]).not.toHaveTextContent(/cannot|twice|kept/);
    expect(fetch).not.toHaveBeenCalled();
    // The last one left cannot be removed.
    for (let i = 0; i < 4; i++) fireEvent.click(screen.getByRole('button', { name: 'Remove reason 1' }));
    expect(screen.getByRole('button', { name: 'Remove reason 1' })).toBeDisabled();
  });

  it('a server refusal lands on its reason; a 409 shows the other person’s list and says to make the change again', async () => {
    let put = 0;
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`PUT ${PATH}`]: () =>
        ++put === 1
          ? problem(422, 'validation', 'The request is not valid.', {
              errors: [{ path: 'reasons.1', message: 'A reason is one line of text.' }],
            })
          : problem(409, 'conflict', 'The list of loss reasons was changed by someone else.'),
      [`GET ${PATH}`]: json(200, { lossReasons: record(['Chose to wait a year'], 5) }),
    });
    renderForm(record(['Price too high', 'Financing not approved']));
    fireEvent.change(rows()[1]!, { target: { value: 'Financing declined' } });
    saveList();
    const items = await screen.findAllByRole('listitem');
    await waitFor(() => expect(items[1]).toHaveTextContent('A reason is one line of text.'));
    expect(screen.queryByText(/^Saved\./)).toBeNull();

    saveList();
    await screen.findByText(
      'Someone else saved the list while you were editing. Their list is shown now; make your change again.',
    );
    await waitFor(() => expect(values()).toEqual(['Chose to wait a year']));
    expect(screen.queryByText(/^Saved\./)).toBeNull();
    expect(puts(fetch)).toHaveLength(2);
  });
});
