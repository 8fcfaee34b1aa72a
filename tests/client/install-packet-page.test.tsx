import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen } from '@testing-library/react';
import { Suspense } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { InstallPacket } from '@contract';
import { PacketPage } from '../../client/src/features/install/components/packet-page';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch } from './helpers/fetch-mock';

const JOB = '0b6f1d7e-3c55-4a8e-9c1e-2f4a5b6c7d8e';

const packet = (pdf: InstallPacket['pdf']): InstallPacket => ({
  jobId: JOB,
  status: 'won',
  company: { name: 'Alder Bay Comfort Co.', phone: '(555) 010-4410' },
  customer: { name: 'Odalys Brackenridge', phone: '555-0100' },
  site: { street: '18 Larkspur Court', unit: '', city: 'Alder Bay', region: 'OR', postalCode: '97000' },
  sold: { versionNumber: 2, optionName: 'Better', signedAt: '2026-12-03T15:00:00.000Z' },
  jobNotes: 'Dog in the yard.',
  systems: [
    {
      name: 'Heat pump 2',
      refrigerant: 'R-454B',
      a2l: true,
      outdoor: {
        model: 'FX-30H2',
        name: 'Tessaline 30k',
        kind: 'multi-zone',
        nominalCoolingBtuh: 30000,
        nominalHeatingBtuh: 32000,
      },
      indoorUnits: [
        {
          zoneName: 'Great room',
          unit: {
            model: 'FW-12W',
            name: 'Tessaline 12k wall head',
            kind: 'wall',
            nominalCoolingBtuh: 12000,
            nominalHeatingBtuh: 13500,
          },
          rooms: [{ name: 'Great room', roomId: 'r1', notes: 'Head above the sliding door.', photos: [] }],
        },
      ],
      lineSets: [
        {
          zoneName: 'Great room',
          liquid: '1/4',
          suction: '1/2',
          plannedLengthFt: 35,
          installedLengthFt: 35,
          kind: 'field-cut',
          liftFt: 8,
          extraChargeOz: 2.2,
          extraChargeText: '35 ft installed − 25 ft pre-charged = 10 ft × 0.22 oz/ft = 2.2 oz',
          condensate: { kind: 'gravity', lengthFt: 10 },
        },
      ],
      extraChargeOz: 2.2,
      totalChargeOz: 88.2,
      electrical: {
        supplyVoltage: 240,
        mcaA: 25,
        mocpA: 40,
        breakerA: 40,
        wireAwg: 10,
        circuitLengthFt: 45,
        disconnectA: 60,
      },
      heatKit: null,
    },
  ],
  extraChargeOz: 2.2,
  totalChargeOz: 88.2,
  materials: [{ description: 'Line set 1/4 x 1/2 insulated', quantity: 35, unit: 'ft', category: 'material' }],
  cautions: [
    { key: 'pressureTest', title: 'Pressure test: dry nitrogen only', text: 'Dry nitrogen through a regulator.' },
    { key: 'a2l', title: 'A2L refrigerant', text: 'A2L-rated tools.' },
  ],
  pdf,
});

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('the job packet page', () => {
  it('shows the sold equipment, where it goes, the charge with its working, and asks for the PDF', async () => {
    let asked = false;
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      [`GET /api/jobs/${JOB}/packet`]: () =>
        json(200, packet(asked ? { state: 'ready', sha256: 'a'.repeat(64) } : { state: 'none', sha256: null })),
      [`POST /api/jobs/${JOB}/packet/pdf`]: () => {
        asked = true;
        return json(202, { state: 'waiting', sha256: null });
      },
    });
    vi.stubGlobal('fetch', fetch);
    render(
      <QueryClientProvider client={createQueryClient()}>
        <Suspense fallback={<p>Loading</p>}>
          <PacketPage jobId={JOB} />
        </Suspense>
      </QueryClientProvider>,
    );
    expect(await screen.findByRole('heading', { name: 'Job packet' })).toBeTruthy();
    expect(screen.getByText('Great room: FW-12W')).toBeTruthy();
    expect(screen.getByText('Head above the sliding door.')).toBeTruthy();
    expect(screen.getByText('35 ft installed − 25 ft pre-charged = 10 ft × 0.22 oz/ft = 2.2 oz')).toBeTruthy();
    expect(screen.getAllByText('88.2 oz').length).toBeGreaterThan(0);
    expect(screen.getByText('R-454B (A2L)')).toBeTruthy();
    expect(screen.getAllByText('A2L refrigerant').length).toBeGreaterThan(0);
    expect(screen.getByText('10 AWG copper')).toBeTruthy();
    expect(document.body.textContent).not.toMatch(/\$/);
    fireEvent.click(screen.getByRole('button', { name: 'Make a PDF of the packet' }));
    const link = await screen.findByRole('link', { name: 'Download the packet as a PDF' });
    expect(link.getAttribute('href')).toBe(`/api/jobs/${JOB}/packet/pdf?download=1`);
  });
});
