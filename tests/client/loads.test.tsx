import { homeLoad } from '@calc';
import { QueryClientProvider } from '@tanstack/react-query';
import { render, screen, within } from '@testing-library/react';
import { Suspense } from 'react';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { LoadPrintPage } from '../../client/src/features/loads/components/load-print-page';
import { LoadsPage } from '../../client/src/features/loads/components/loads-page';
import { compareLoads } from '../../client/src/features/loads/model/compare';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';
import { bedroomInput, designConditions, JOB_ID, jobRecord, roomRecord } from './helpers/walkthrough-harness';

afterEach(() => vi.unstubAllGlobals());

const home = { designConditions, tightness: 'average' as const, rooms: [bedroomInput] };
const serverBody = (load = homeLoad({ home })) => ({
  jobId: JOB_ID,
  jobVersion: 2,
  tightness: 'average',
  designConditions,
  loads: load,
  warnings: { designConditions: [], rooms: {} },
});

function renderAt(path: string, element: React.ReactNode) {
  render(
    <QueryClientProvider client={createQueryClient()}>
      <MemoryRouter initialEntries={[path]}>
        <Suspense fallback="loading">
          <Routes>
            <Route path="/jobs/:jobId/loads" element={element} />
            <Route path="/jobs/:jobId/loads/print" element={element} />
          </Routes>
        </Suspense>
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

function mockJob(loads: ReturnType<typeof json>) {
  mockFetch({
    [`GET /api/jobs/${JOB_ID}`]: json(200, { job: jobRecord() }),
    [`GET /api/jobs/${JOB_ID}/rooms`]: json(200, { rooms: [roomRecord(bedroomInput, 3)] }),
    [`GET /api/jobs/${JOB_ID}/loads`]: loads,
  });
}

describe('loads page', () => {
  it('compares the browser’s numbers with the server’s', () => {
    const browser = homeLoad({ home });
    expect(compareLoads(browser, serverBody(browser))).toEqual([]);
    const off = { ...browser, totals: { ...browser.totals, heatingBtuh: browser.totals.heatingBtuh + 5 } };
    expect(compareLoads(browser, serverBody(off))).toEqual([
      { what: 'Whole-home heat loss', browser: browser.totals.heatingBtuh, server: browser.totals.heatingBtuh + 5 },
    ]);
  });

  it('shows totals, the estimate badge and a "checked against server" note', async () => {
    mockJob(json(200, serverBody()));
    renderAt(`/jobs/${JOB_ID}/loads`, <LoadsPage />);
    // The room cards' chart loads lazily (its own chunk): the first import in a busy test run takes a while.
    const totals = await screen.findByRole('region', { name: 'Whole-home loads' }, { timeout: 5000 });
    const expected = homeLoad({ home }).totals;
    expect(totals).toHaveTextContent(`${expected.coolingBtuh.toLocaleString('en-US')} Btu/h`);
    expect(totals).toHaveTextContent(expected.sensibleHeatRatio.toFixed(2));
    expect(within(totals).getByText('Estimate')).toBeInTheDocument();
    expect(await screen.findByText(/Checked against server/)).toBeInTheDocument();
    expect(screen.getByRole('article', { name: 'Loads for Bedroom 2' })).toBeInTheDocument();
    expect(screen.getByText('How these numbers are worked out')).toBeInTheDocument();
  });

  it('says so when the server’s numbers differ', async () => {
    const load = homeLoad({ home });
    mockJob(json(200, serverBody({ ...load, totals: { ...load.totals, sensibleBtuh: 1 } })));
    renderAt(`/jobs/${JOB_ID}/loads`, <LoadsPage />);
    expect(await screen.findByText(/The server’s numbers differ/)).toBeInTheDocument();
    expect(screen.getByText(/Whole-home sensible gain: browser/)).toBeInTheDocument();
  });

  it('says when the server cannot check', async () => {
    mockJob(problem(422, 'unprocessable', 'Add at least one room before the loads can be worked out.'));
    renderAt(`/jobs/${JOB_ID}/loads`, <LoadsPage />);
    expect(await screen.findByText(/Not checked against the server/)).toBeInTheDocument();
  });

  it('prints one sheet with the inputs it used and the method', async () => {
    mockJob(json(200, serverBody()));
    renderAt(`/jobs/${JOB_ID}/loads/print`, <LoadPrintPage />);
    expect(await screen.findByRole('button', { name: 'Print' })).toBeInTheDocument();
    expect(screen.getByRole('region', { name: 'Inputs used' })).toHaveTextContent('Outdoor cooling dry bulb');
    expect(screen.getByRole('region', { name: 'Room results' })).toHaveTextContent('Bedroom 2');
    expect(screen.getByText(/A load estimate is an estimate/)).toBeInTheDocument();
    expect(document.querySelector('style')?.textContent).toContain('@media print');
  });
});
