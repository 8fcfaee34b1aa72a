import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { Suspense } from 'react';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  PROPOSAL_EVENT_KINDS,
  type ProposalEventRecord,
  type ProposalResponse,
  type ProposalVersionRecord,
  type Role,
} from '../../server/src/contract';
import { ProposalPage } from '../../client/src/features/proposals/components/proposal-page';
import { describeEvent } from '../../client/src/features/proposals/model/event-words';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { ViewerContext } from '../../client/src/lib/viewer';
import { json, mockFetch, problem } from './helpers/fetch-mock';
import { JOB_ID, jobRecord } from './helpers/walkthrough-harness';

/** Issue 14 (office14): the office's proposal screen against a stand-in server. */
beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

const base = `/api/jobs/${JOB_ID}/proposal`;

function version(n: number, current: boolean, state: ProposalVersionRecord['pdf']['state']): ProposalVersionRecord {
  return {
    number: n,
    issuedAt: `2026-12-0${n}T15:00:00.000Z`,
    issuedBy: { id: 'u-est', name: 'Esme Estimator' },
    supersededAt: current ? null : '2026-12-04T15:00:00.000Z',
    current,
    snapshotSha256: 'a'.repeat(64),
    calcVersion: '0.1.0',
    pdf: { state, sha256: state === 'ready' ? 'b'.repeat(64) : null },
    options: [{ name: 'Essential', totalCents: 1_234_500 }],
  };
}

const event = (seq: number, kind: ProposalEventRecord['kind'], n: number | null, data = {}): ProposalEventRecord => ({
  seq,
  kind,
  at: '2026-12-04T15:00:00.000Z',
  versionNumber: n,
  by: { kind: 'staff', id: 'u-est', name: 'Esme Estimator' },
  data,
});

/** send14's panel asks for the links sent (the office's screen shows it); none sent yet. */
const links = json(200, { customerEmail: 'rowan@example.com', canSend: { ok: true, versionNumber: 2 }, links: [] });

const none: ProposalResponse = { jobId: JOB_ID, canIssue: { ok: true }, proposal: null };
const two = (v2: ProposalVersionRecord['pdf']['state']): ProposalResponse => ({
  jobId: JOB_ID,
  canIssue: { ok: true },
  proposal: {
    id: 'p1',
    createdAt: '2026-12-03T15:00:00.000Z',
    versions: [version(2, true, v2), version(1, false, 'ready')],
    events: [
      event(1, 'issued', 1),
      event(4, 'pdf-failed', 2, { reason: 'disk full', attempts: 5 }),
      event(2, 'superseded', 1, { number: 1, by: 2 }),
      event(3, 'issued', 2),
    ],
  },
});

function renderPage(role: Role) {
  return render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter initialEntries={[`/jobs/${JOB_ID}/proposal`]}>
        <ViewerContext.Provider value={{ id: `u-${role}`, role }}>
          <Suspense fallback="loading">
            <Routes>
              <Route path="/jobs/:jobId/proposal" element={<ProposalPage />} />
            </Routes>
          </Suspense>
        </ViewerContext.Provider>
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('the proposal screen', () => {
  it('the estimator issues version 1; a 409 says why in the server’s words and nothing is shown as issued', async () => {
    const fetch = mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord({ status: 'design' }) }),
      [`GET ${base}`]: json(200, none),
      [`GET ${base}/links`]: links,
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`POST ${base}/versions`]: (_init, call) =>
        call === 1
          ? problem(409, 'conflict', 'Mark the job ready to propose on the desk first.')
          : json(201, two('waiting')),
    });
    renderPage('estimator');
    expect(await screen.findByText('No version issued yet')).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Issue version 1' }));
    const refused = await screen.findByRole('alert');
    expect(refused).toHaveTextContent('The version was not issued.');
    expect(refused).toHaveTextContent('Mark the job ready to propose on the desk first.');

    fireEvent.click(screen.getByRole('button', { name: 'Issue version 1' }));
    expect(await screen.findByText('Version 2 issued.')).toBeInTheDocument();
    const versions = screen.getByRole('region', { name: 'Versions' });
    const items = within(versions).getAllByRole('button');
    expect(items.map((b) => b.textContent)).toEqual([
      expect.stringMatching(/^Version 2CurrentPDF waiting its turn/),
      expect.stringMatching(/^Version 1SupersededPDF ready/),
    ]);
    expect(screen.getByRole('region', { name: 'PDF of version 2' })).toHaveTextContent('Waiting its turn');
    expect(fetch.mock.calls.filter(([, init]) => init?.method === 'POST')).toHaveLength(2);
    // The send panel sits below the versions once there is one to send.
    expect(await screen.findByRole('region', { name: 'Send to the customer' })).toBeInTheDocument();
  });

  it('shows a failed PDF’s reason with “Try again”, the ready one’s preview, and the trail in seq order', async () => {
    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord({ status: 'design', hasProposal: true }) }),
      [`GET ${base}`]: json(200, two('failed')),
      [`GET ${base}/links`]: links,
      [`GET ${base}/versions/1/diff/2`]: json(200, {
        from: 1,
        to: 2,
        changes: [
          { area: 'line sets', path: 'a', sentence: 'Essential: line set run (ft) 35 → 45.' },
          { area: 'prices', path: 'b', sentence: 'Essential: total $12,000.00 → $12,345.00.' },
        ],
      }),
    });
    renderPage('estimator');
    const pdf = await screen.findByRole('region', { name: 'PDF of version 2' });
    expect(pdf).toHaveTextContent('The PDF could not be made.');
    expect(pdf).toHaveTextContent('Why: disk full');
    expect(within(pdf).getByRole('button', { name: 'Try again' })).toBeInTheDocument();

    const changed = screen.getByRole('region', { name: 'What changed' });
    expect(await within(changed).findByText('Essential: line set run (ft) 35 → 45.')).toBeInTheDocument();
    expect(within(changed).getByRole('heading', { name: 'Line sets' })).toBeInTheDocument();
    expect(within(changed).getByRole('heading', { name: 'Prices' })).toBeInTheDocument();

    const trail = screen.getByRole('list', { name: 'Audit trail' });
    expect(
      within(trail)
        .getAllByRole('listitem')
        .map((li) => li.firstChild?.textContent),
    ).toEqual([
      'Version 1 issued',
      'Version 1 superseded by version 2',
      'Version 2 issued',
      'PDF of version 2 could not be made after 5 tries',
    ]);

    fireEvent.click(within(screen.getByRole('region', { name: 'Versions' })).getAllByRole('button')[1] as HTMLElement);
    const ready = await screen.findByRole('region', { name: 'PDF of version 1' });
    expect(within(ready).getByTitle('Proposal version 1, PDF preview')).toHaveAttribute(
      'src',
      `${base}/versions/1/pdf`,
    );
    expect(within(ready).getByRole('link', { name: 'Download the PDF' })).toHaveAttribute(
      'href',
      `${base}/versions/1/pdf?download=1`,
    );
  });

  it('a signed version: no “Issue version 3”, the reason in the server’s words, no way to the desk offered as if there were', async () => {
    const reason =
      'Version 2 was signed on December 4, 2026 by Rowan Quell, and a signed contract is not changed here: a change after signing is agreed with the customer outside this proposal.';
    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord({ status: 'won', hasProposal: true }) }),
      [`GET ${base}`]: json(200, {
        ...two('ready'),
        canIssue: {
          ok: false,
          reason,
          signed: { versionNumber: 2, signedOn: '2026-12-04', signerName: 'Rowan Quell' },
        },
      }),
      [`GET ${base}/links`]: links,
      [`GET ${base}/versions/1/diff/2`]: json(200, { from: 1, to: 2, changes: [] }),
    });
    renderPage('estimator');
    const panel = await screen.findByRole('region', { name: 'Signed' });
    expect(panel).toHaveTextContent(reason);
    expect(screen.queryByRole('button', { name: /Issue version/ })).toBeNull();
    expect(within(panel).queryByRole('link', { name: 'Open the desk' })).toBeNull();
  });

  it('marked ready before the current version was issued: “send that one”, and “Issue version 3” is the quieter button', async () => {
    const job = (readyToProposeAt: string) =>
      json(200, { job: jobRecord({ status: 'design', hasProposal: true, readyToProposeAt }) });
    const common = {
      [`GET ${base}`]: json(200, two('ready')),
      [`GET ${base}/links`]: links,
      [`GET ${base}/versions/1/diff/2`]: json(200, { from: 1, to: 2, changes: [] }),
    };
    // Version 2 was issued on 2 December 15:00 UTC; the mark is from the 1st.
    mockFetch({ [`GET /api/jobs/${JOB_ID}`]: job('2026-12-01T10:00:00.000Z'), ...common });
    const view = renderPage('estimator');
    const button = await screen.findByRole('button', { name: 'Issue version 3' });
    expect(
      screen.getByText(/^Nothing on the desk has changed since version 2 was issued: send that one\./),
    ).toBeVisible();
    expect(button.className).toMatch(/bg-white/);
    view.unmount();

    // Marked again after a change on the 3rd: the new version is the thing to do.
    mockFetch({ [`GET /api/jobs/${JOB_ID}`]: job('2026-12-03T10:00:00.000Z'), ...common });
    renderPage('estimator');
    expect((await screen.findByRole('button', { name: 'Issue version 3' })).className).toMatch(/bg-ink-800/);
    expect(screen.queryByText(/^Nothing on the desk has changed/)).toBeNull();
  });

  it('reads in the phone’s order: issue, versions, the PDF, sending, what changed, the audit trail last', async () => {
    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord({ status: 'design', hasProposal: true }) }),
      [`GET ${base}`]: json(200, two('ready')),
      [`GET ${base}/links`]: links,
      [`GET ${base}/versions/1/diff/2`]: json(200, { from: 1, to: 2, changes: [] }),
    });
    renderPage('estimator');
    await screen.findByRole('region', { name: 'Send to the customer' });
    // The DOM order is the one-column phone order (and so a screen reader's); from lg the PDF moves right.
    const names = screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent);
    expect(names).toEqual([
      'Issue a new version',
      'Versions',
      'PDF of version 2',
      'Send to the customer',
      'What changed',
      'What happened, in order',
    ]);
  });

  it('no business address: the reason and, for the owner, the way to Settings; an estimator is sent to the owner', async () => {
    const noAddress = (who: string): ProposalResponse => ({
      jobId: JOB_ID,
      canIssue: {
        ok: false,
        fix: 'settings',
        reason: `${who} the business address in Settings (On every proposal) first: the notice … (16 CFR 429.1).`,
      },
      proposal: null,
    });
    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord({ status: 'design' }) }),
      [`GET ${base}`]: json(200, noAddress('Add')),
      [`GET ${base}/links`]: links,
    });
    const view = renderPage('owner');
    const why = await screen.findByText(/^Add the business address in Settings/);
    const box = why.closest('[role="alert"], [role="status"], div') as HTMLElement;
    expect(screen.queryByRole('button', { name: /Issue version/ })).toBeNull();
    expect(within(box.parentElement ?? box).getByRole('link', { name: 'Open Settings' })).toHaveAttribute(
      'href',
      '/settings',
    );
    expect(screen.queryByRole('link', { name: 'Open the desk' })).toBeNull();
    view.unmount();

    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord({ status: 'design' }) }),
      [`GET ${base}`]: json(200, noAddress('Ask the owner to add')),
      [`GET ${base}/links`]: links,
    });
    renderPage('estimator');
    expect(await screen.findByText(/^Ask the owner to add the business address in Settings/)).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Open Settings' })).toBeNull();
    expect(screen.queryByRole('link', { name: 'Open the desk' })).toBeNull();
  });

  it('a salesperson reads it without issuing or the PDF; an installer is turned away before anything is asked', async () => {
    mockFetch({
      [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord({ status: 'design', hasProposal: true }) }),
      [`GET ${base}`]: json(200, { ...two('ready'), canIssue: { ok: false, reason: 'Only the office issues.' } }),
      [`GET ${base}/versions/1/diff/2`]: json(200, { from: 1, to: 2, changes: [] }),
    });
    const view = renderPage('salesperson');
    const pdf = await screen.findByRole('region', { name: 'PDF of version 2' });
    expect(pdf).toHaveTextContent('The office previews and downloads it.');
    expect(screen.queryByRole('button', { name: /Issue version/ })).toBeNull();
    expect(within(pdf).queryByTitle(/PDF preview/)).toBeNull();
    expect(await screen.findByText('Nothing the customer sees differs between version 1 and version 2.')).toBeVisible();
    view.unmount();

    const fetch = mockFetch({});
    renderPage('installer');
    expect(screen.getByText('Proposals are for the office and the job’s salesperson.')).toBeInTheDocument();
    expect(fetch).not.toHaveBeenCalled();
  });
});

describe('the audit trail’s words', () => {
  it('every kind the contract names has its own sentence', () => {
    const titles = PROPOSAL_EVENT_KINDS.map((k) => describeEvent(event(1, k, 2)).title);
    for (const t of titles) expect(t.length).toBeGreaterThan(10);
    expect(new Set(titles).size).toBe(PROPOSAL_EVENT_KINDS.length);
  });

  it('reads only the expected keys, as text', () => {
    expect(describeEvent(event(1, 'marked-lost', 1, { reason: 'Price too high', from: 'proposed' })).title).toBe(
      'Job marked lost: Price too high',
    );
    expect(describeEvent(event(1, 'paid', 1, { amountCents: 150000 })).title).toBe('Deposit paid: $1,500.00');
    expect(describeEvent(event(1, 'option-chosen', 1, { position: 2 })).title).toBe('The customer chose option 2');
    // A non-string value where a string belongs is left out, not printed.
    expect(describeEvent(event(1, 'sent', 1, { to: { html: '<b>x</b>' } })).title).toBe(
      'Version 1 sent to the customer',
    );
  });
});
