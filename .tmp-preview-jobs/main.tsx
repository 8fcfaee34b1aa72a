import '../client/src/styles.css';
import { QueryClientProvider } from '@tanstack/react-query';
import { Suspense } from 'react';
import { createRoot } from 'react-dom/client';
import { MemoryRouter, Route, Routes } from 'react-router-dom';
import { homeLoad } from '@calc';
import { createQueryClient } from '../client/src/lib/query-client';
import { WalkthroughPage } from '../client/src/features/walkthrough/components/walkthrough-page';
import { LoadsPage } from '../client/src/features/loads/components/loads-page';
import { LoadPrintPage } from '../client/src/features/loads/components/load-print-page';
import { JobsListPage } from '../client/src/features/jobs/components/jobs-list-page';
import { NewJobPage } from '../client/src/features/jobs/components/new-job-page';

const JOB = '11111111-1111-4111-8111-111111111111';
const dc = { outdoorCoolingDryBulbF: 95, outdoorCoolingWetBulbF: 75, outdoorHeatingDryBulbF: 20, indoorCoolingF: 75, indoorHeatingF: 70, indoorCoolingRhPercent: 50, dailyRangeF: 20, elevationFt: 0 };
const job = { id: JOB, status: 'walkthrough', customer: { id: 'c1', name: 'Rowan Example' }, site: { street: '12 Sample Lane', unit: '', city: 'Testville', region: 'TS', postalCode: '00000' }, salesperson: { id: 'u1', name: 'Sam Seller' }, assignedInstaller: null, notes: '', designConditions: dc, designSources: { outdoorCoolingDryBulbF: { source: 'company-default', note: '' }, outdoorHeatingDryBulbF: { source: 'entered', note: 'County table' } }, tightness: 'average', version: 2, createdAt: '2026-01-01T00:00:00.000Z', updatedAt: '2026-01-01T00:00:00.000Z', lastActivityAt: '2026-01-01T00:00:00.000Z' };
const names = ['Living room', 'Kitchen', 'Bedroom 1', 'Bedroom 2', 'Bedroom 3', 'Bathroom', 'Office', 'Hall', 'Dining', 'Laundry', 'Family room', 'Primary bedroom'];
const rooms = names.slice(0, Number(new URLSearchParams(location.search).get('rooms') ?? '4')).map((name, i) => {
  const id = `22222222-2222-4222-8222-${String(i).padStart(12, '0')}`;
  return { id, jobId: JOB, position: i, version: 1, createdAt: '', updatedAt: '', photos: [], input: { id, name, floorLevel: 1, lengthFt: 12 + i, widthFt: 11, ceilingHeightFt: 8, exposedWalls: [{ direction: ['N', 'E', 'S', 'W'][i % 4], lengthFt: 12, construction: 'wood-2x4-r13', windows: [{ widthIn: 36, heightIn: 48, count: 2, glazing: 'double-clear', interiorShading: 'blinds' }], doors: [] }], above: { kind: 'attic', insulation: 'r30' }, below: { kind: 'slab', edgeInsulated: false }, occupants: 2, appliances: [], notes: '' } };
});
const load = homeLoad({ home: { designConditions: dc, tightness: 'average', rooms: rooms.map((r) => r.input) as never } });
const replies: Record<string, unknown> = {
  [`/api/jobs/${JOB}`]: { job },
  [`/api/jobs/${JOB}/rooms`]: { rooms },
  [`/api/jobs/${JOB}/loads`]: { jobId: JOB, jobVersion: 2, tightness: 'average', designConditions: dc, loads: load, warnings: {} },
  '/api/company/settings': { settings: { unitSystem: 'imperial', defaultDesignConditions: dc, version: 1, updatedAt: null, designConditionsNotice: 'Design values must come from the local code’s climate table or a recognised climatic data source for the site.' } },
  '/api/customers?page=1&pageSize=20': { items: [], total: 0, page: 1, pageSize: 20 },
};
window.fetch = async (input) => {
  const url = String(input);
  if (url.startsWith('/api/jobs?')) return new Response(JSON.stringify({ items: Array.from({ length: 8 }, (_, i) => ({ ...job, id: `${JOB.slice(0, -1)}${i}`, customer: { id: 'c', name: `Customer ${i + 1}` } })), total: 40, page: 1, pageSize: 25 }), { headers: { 'Content-Type': 'application/json' } });
  const body = replies[url];
  if (!body) return new Response('{}', { status: 404, headers: { 'Content-Type': 'application/json' } });
  return new Response(JSON.stringify(body), { headers: { 'Content-Type': 'application/json' } });
};
const path = new URLSearchParams(location.search).get('path') ?? `/jobs/${JOB}`;
createRoot(document.getElementById('root')!).render(
  <QueryClientProvider client={createQueryClient()}>
    <MemoryRouter initialEntries={[path]}>
      <main className="mx-auto max-w-5xl px-4 py-4">
        <Suspense fallback="loading">
          <Routes>
            <Route path="/jobs" element={<JobsListPage />} />
            <Route path="/jobs/new" element={<NewJobPage />} />
            <Route path="/jobs/:jobId" element={<WalkthroughPage />} />
            <Route path="/jobs/:jobId/loads" element={<LoadsPage />} />
            <Route path="/jobs/:jobId/loads/print" element={<LoadPrintPage />} />
          </Routes>
        </Suspense>
      </main>
    </MemoryRouter>
  </QueryClientProvider>,
);
