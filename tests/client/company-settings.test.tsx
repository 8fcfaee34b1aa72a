import { QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { Suspense } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CompanySettingsRecord } from '@contract';
import { DesignDefaultsForm } from '../../client/src/features/company-settings/components/design-defaults-form';
import { UnitSystemForm } from '../../client/src/features/company-settings/components/unit-system-form';
import { jobKeys } from '../../client/src/entities/job/query-keys';
import { clearCsrfToken } from '../../client/src/lib/api-client';
import { createQueryClient } from '../../client/src/lib/query-client';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const SAVED = {
  outdoorCoolingDryBulbF: 91,
  outdoorCoolingWetBulbF: 74,
  outdoorHeatingDryBulbF: 28,
  indoorCoolingF: 75,
  indoorHeatingF: 70,
  indoorCoolingRhPercent: 50,
  dailyRangeF: 22,
  elevationFt: 500,
  latitudeDeg: -33.9,
  clearSkyTauB: 0.38,
  clearSkyTauD: 2.4,
  clearSkySource: 'Invented station table, January',
  source: 'Invented county code table',
};

function settings(over: Partial<CompanySettingsRecord> = {}): CompanySettingsRecord {
  return {
    unitSystem: 'imperial',
    defaultDesignConditions: SAVED,
    version: 4,
    updatedAt: '2026-12-01T00:00:00.000Z',
    designConditionsNotice: 'Design values must come from the local code’s climate table.',
    ...over,
  };
}

function renderPage(record: CompanySettingsRecord) {
  const client = createQueryClient();
  client.setQueryData(jobKeys.settings(), record);
  render(
    <QueryClientProvider client={client}>
      <Suspense fallback="loading">
        <UnitSystemForm />
        <DesignDefaultsForm />
      </Suspense>
    </QueryClientProvider>,
  );
  return client;
}

const field = (label: string) => screen.getByLabelText(label);
const puts = (fetch: ReturnType<typeof mockFetch>) => fetch.mock.calls.filter(([, init]) => init?.method === 'PUT');
const save = () => fireEvent.click(screen.getByRole('button', { name: 'Save design defaults' }));

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

describe('company design defaults page', () => {
  it('shows the saved defaults as read: latitude in degrees with S pressed, each field with its bounds', () => {
    mockFetch({});
    renderPage(settings());
    expect(field('Latitude')).toHaveValue('33.9');
    const hemisphere = screen.getByRole('group', { name: 'Hemisphere' });
    expect(within(hemisphere).getByRole('button', { name: 'South (S)' })).toHaveAttribute('aria-pressed', 'true');
    expect(field('Outdoor cooling dry bulb')).toHaveValue('91');
    expect(field('Clear-sky beam optical depth τb')).toHaveValue('0.38');
    // the bounds are calc's designConditionsSchema's, said beside each field
    expect(screen.getByText('Between 50 and 130 °F.')).toBeInTheDocument();
    expect(screen.getByText('Between 60° S and 70° N.')).toBeInTheDocument();
    expect(screen.getByText('Between 0.1 and 1.5.')).toBeInTheDocument();
    expect(screen.getByText('Design values must come from the local code’s climate table.')).toBeInTheDocument();
  });

  it('refuses a value out of bounds beside its field and sends nothing', async () => {
    const fetch = mockFetch({});
    renderPage(settings());
    fireEvent.change(field('Indoor heating set point'), { target: { value: '99' } });
    fireEvent.change(field('Clear-sky diffuse optical depth τd'), { target: { value: '' } });
    fireEvent.change(field('Latitude'), { target: { value: '75' } });
    save();
    expect(await screen.findByText('Indoor heating set point must be between 50 and 85 °F')).toBeInTheDocument();
    expect(field('Indoor heating set point')).toHaveAttribute('aria-invalid', 'true');
    expect(
      screen.getByText('Enter both optical depths (τb and τd) from the same climatic table, or neither'),
    ).toBeInTheDocument();
    expect(screen.getByText('Latitude must be between 60° S and 70° N')).toBeInTheDocument();
    expect(puts(fetch)).toHaveLength(0);
  });

  it('saves signed latitude, month and sky source with If-Match, says Saved only while nothing changed since', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'PUT /api/company/settings': (init) => {
        const body = JSON.parse(String(init?.body)) as Pick<
          CompanySettingsRecord,
          'unitSystem' | 'defaultDesignConditions'
        >;
        return json(200, { settings: { ...settings(), ...body, version: 5 } });
      },
    });
    renderPage(settings());
    fireEvent.change(field('Latitude'), { target: { value: '34.1' } });
    fireEvent.change(field('Cooling design month'), { target: { value: '2' } });
    fireEvent.change(field('Design ground temperature (basements)'), { target: { value: '52' } });
    expect(screen.getByText('Changes not saved yet.')).toBeInTheDocument();
    save();
    expect(await screen.findByText('Saved. New jobs start from these values.')).toBeInTheDocument();
    const [put] = puts(fetch);
    expect((put?.[1]?.headers as Record<string, string>)['If-Match']).toBe('"4"');
    const sent = JSON.parse(String(put?.[1]?.body)) as { unitSystem: string; defaultDesignConditions: object };
    expect(sent).toEqual({
      unitSystem: 'imperial',
      defaultDesignConditions: { ...SAVED, latitudeDeg: -34.1, designMonth: 2, groundDesignF: 52 },
    });
    // after the save the form shows the server's answer; a new edit takes "Saved" away
    expect(field('Latitude')).toHaveValue('34.1');
    fireEvent.change(field('Elevation'), { target: { value: '600' } });
    expect(screen.queryByText('Saved. New jobs start from these values.')).toBeNull();
    expect(screen.getByText('Changes not saved yet.')).toBeInTheDocument();
  });

  it('puts the server’s problem+json field errors beside the field', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'PUT /api/company/settings': problem(400, 'validation', 'Some fields need attention.', {
        errors: [{ path: 'defaultDesignConditions.clearSkyTauB', message: 'Refused by the server for this test' }],
      }),
    });
    renderPage(settings());
    save();
    expect(await screen.findByText('Refused by the server for this test')).toBeInTheDocument();
    expect(field('Clear-sky beam optical depth τb')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.queryByText('Saved. New jobs start from these values.')).toBeNull();
  });

  it('a metric company reads and types °C; an unchanged value keeps its saved °F exactly', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'PUT /api/company/settings': (init) => {
        const body = JSON.parse(String(init?.body)) as Pick<
          CompanySettingsRecord,
          'unitSystem' | 'defaultDesignConditions'
        >;
        return json(200, { settings: { ...settings({ unitSystem: 'metric' }), ...body, version: 5 } });
      },
    });
    renderPage(settings({ unitSystem: 'metric' }));
    // 91 °F = 32.78 °C, shown to 0.1 (lib/unit-display.ts rounding for temperatures)
    expect(field('Outdoor cooling dry bulb')).toHaveValue('32.8');
    fireEvent.change(field('Indoor cooling set point'), { target: { value: '40' } });
    save();
    // 60–90 °F is 15.6–32.2 °C: the bound is said in the company's units
    expect(await screen.findByText('Indoor cooling set point must be between 15.6 and 32.2 °C')).toBeInTheDocument();
    fireEvent.change(field('Indoor cooling set point'), { target: { value: '25' } });
    save();
    await screen.findByText('Saved. New jobs start from these values.');
    const sent = JSON.parse(String(puts(fetch)[0]?.[1]?.body)) as { defaultDesignConditions: Record<string, number> };
    expect(sent.defaultDesignConditions.outdoorCoolingDryBulbF).toBe(91);
    // 25 °C = 77 °F (°F = °C × 9/5 + 32)
    expect(sent.defaultDesignConditions.indoorCoolingF).toBeCloseTo(77, 9);
  });

  it('the units form sends the saved defaults back unchanged with the new unit system', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'PUT /api/company/settings': (init) =>
        json(200, { settings: { ...settings(), ...JSON.parse(String(init?.body)), version: 5 } }),
    });
    renderPage(settings());
    fireEvent.change(screen.getByRole('combobox', { name: 'Units' }), { target: { value: 'metric' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save units' }));
    await waitFor(() => expect(puts(fetch)).toHaveLength(1));
    expect(JSON.parse(String(puts(fetch)[0]?.[1]?.body))).toEqual({
      unitSystem: 'metric',
      defaultDesignConditions: SAVED,
    });
    // the design form now shows °C
    expect(await screen.findByText('Between 10 and 54.4 °C.')).toBeInTheDocument();
  });
});
