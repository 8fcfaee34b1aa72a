import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { SigningState } from '@contract';
import { SigningSteps } from '../../client/src/features/customer-proposal/signing';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const P = '7c0e2b1a-4d3f-4a5b-9c8d-1e2f3a4b5c6d';
const base: SigningState = {
  version: { number: 2, pdfReady: true },
  option: { position: 2, name: 'Better', totalCents: 1_598_000, depositCents: 159_800 },
  consent: {
    disclosureVersion: 'esign-2026-12-1',
    paragraphs: [
      { heading: 'What you agree to', text: 'You agree to sign electronically.' },
      { heading: 'Paper copies', text: 'You have the right to have any of these records on paper.' },
    ],
    sha256: 'a'.repeat(64),
    givenAt: null,
  },
  statement: { text: 'I accept option 2, “Better”, of proposal version 2.', sha256: 'b'.repeat(64) },
  signerDefaults: { name: 'Ezekiel Thornbury', email: 'ezekiel@example.com' },
  signature: null,
  signedPdf: null,
};
const consented: SigningState = { ...base, consent: { ...base.consent, givenAt: '2026-12-05T14:01:57.000Z' } };
const signed: SigningState = {
  ...consented,
  signature: {
    signedAt: '2026-12-05T14:03:27.000Z',
    signerName: 'Ezekiel Thornbury',
    method: 'typed',
    optionPosition: 2,
  },
  signedPdf: 'ready',
};

function renderSteps() {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <SigningSteps proposalId={P} chosenPosition={2} />
    </QueryClientProvider>,
  );
}

/** jsdom has no canvas drawing or ResizeObserver; the drawing box needs both to mount. */
beforeEach(() => {
  clearCsrfToken();
  vi.stubGlobal(
    'ResizeObserver',
    class {
      observe() {}
      disconnect() {}
    },
  );
  const ctx = new Proxy({}, { get: () => () => undefined, set: () => true });
  vi.spyOn(HTMLCanvasElement.prototype, 'getContext').mockImplementation(() => ctx as CanvasRenderingContext2D);
});
afterEach(() => {
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

const bodyOf = (fetch: ReturnType<typeof mockFetch>, key: string) => {
  const call = fetch.mock.calls.find(([url, init]) => `${init?.method ?? 'GET'} ${String(url)}` === key);
  return call ? (JSON.parse(String(call[1]?.body)) as Record<string, unknown>) : undefined;
};

describe('SigningSteps (the customer signs)', () => {
  it('consent first: the full text, a box to tick before the button works, and the hash of the text shown sent', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`GET /api/proposals/${P}/signing`]: (_i, n) => json(200, n === 1 ? base : consented),
      [`POST /api/proposals/${P}/consent`]: json(200, consented),
    });
    renderSteps();
    expect(await screen.findByText('You have the right to have any of these records on paper.')).toBeInTheDocument();
    expect(screen.getByText(/15 U\.S\.C\. §7001\(c\)/)).toBeInTheDocument();
    const agree = screen.getByRole('button', { name: /I agree — continue to sign/ });
    expect(agree).toBeDisabled();
    fireEvent.click(screen.getByRole('checkbox', { name: /I agree to sign electronically/ }));
    expect(agree).toBeEnabled();
    fireEvent.click(agree);
    expect(await screen.findByRole('tab', { name: 'Type my name' })).toBeInTheDocument();
    expect(bodyOf(fetch, `POST /api/proposals/${P}/consent`)).toEqual({
      versionNumber: 2,
      disclosureSha256: 'a'.repeat(64),
    });
  });

  it('signs with a typed name: sends the option, the statement hash and the signer; then offers the signed copy', async () => {
    let done = false;
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`GET /api/proposals/${P}/signing`]: () => json(200, done ? signed : consented),
      [`POST /api/proposals/${P}/signature`]: () => {
        done = true;
        return json(201, signed);
      },
    });
    renderSteps();
    expect(await screen.findByText(/I accept option 2/)).toBeInTheDocument();
    expect(screen.getByLabelText('Your full name')).toHaveValue('Ezekiel Thornbury');
    fireEvent.click(screen.getByRole('tab', { name: 'Type my name' }));
    fireEvent.click(screen.getByRole('button', { name: 'Sign and accept the proposal' }));
    expect(await screen.findByText('Type your name as your signature.')).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText('Type your name as your signature'), {
      target: { value: 'Ezekiel Thornbury' },
    });
    fireEvent.click(screen.getByRole('button', { name: 'Sign and accept the proposal' }));
    const download = await screen.findByRole('link', { name: 'Download your signed copy (PDF)' });
    expect(download).toHaveAttribute('href', `/api/proposals/${P}/signed-pdf`);
    expect(bodyOf(fetch, `POST /api/proposals/${P}/signature`)).toEqual({
      method: 'typed',
      versionNumber: 2,
      optionPosition: 2,
      statementSha256: 'b'.repeat(64),
      signerName: 'Ezekiel Thornbury',
      signerEmail: 'ezekiel@example.com',
      typedName: 'Ezekiel Thornbury',
    });
  });

  it('a drawn signature is required before signing; a superseded version says so and offers a reload', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`GET /api/proposals/${P}/signing`]: json(200, consented),
      [`POST /api/proposals/${P}/signature`]: problem(
        409,
        'conflict',
        'This proposal was replaced by version 3 after you opened it.',
        { reason: 'superseded' },
      ),
    });
    renderSteps();
    fireEvent.click(await screen.findByRole('button', { name: 'Sign and accept the proposal' }));
    expect(await screen.findByText('Draw your signature in the box.')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('tab', { name: 'Type my name' }));
    fireEvent.change(screen.getByLabelText('Type your name as your signature'), { target: { value: 'E. Thornbury' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign and accept the proposal' }));
    expect(await screen.findByText(/replaced by version 3/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Reload the page' })).toBeInTheDocument();
  });

  it('while the signed copy is being made it says so instead of a link', async () => {
    mockFetch({ [`GET /api/proposals/${P}/signing`]: json(200, { ...signed, signedPdf: 'waiting' }) });
    renderSteps();
    expect(await screen.findByText(/Your signed copy is being prepared/)).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: /Download your signed copy/ })).toBeNull();
    expect(screen.getByText(/Signed by/)).toBeInTheDocument();
  });
});
