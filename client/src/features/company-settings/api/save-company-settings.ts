import { useMutation, useQueryClient } from '@tanstack/react-query';
import { settingsResponse, type CompanySettingsRecord, type UnitSystem } from '@contract';
import { apiFetch } from '../../../lib/api-client';
import { COMPANY_SETTINGS_PATH } from '../../../entities/job/paths';
import { jobKeys } from '../../../entities/job/query-keys';

export interface CompanySettingsBody {
  unitSystem: UnitSystem;
  defaultDesignConditions: Record<string, unknown> | null;
}

/** PUT the whole settings document with If-Match; the answer replaces the cached settings every screen reads. */
export async function saveCompanySettings(body: CompanySettingsBody, version: number): Promise<CompanySettingsRecord> {
  return (await apiFetch(COMPANY_SETTINGS_PATH, { method: 'PUT', body, version, schema: settingsResponse })).settings;
}

export function useSaveCompanySettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ body, version }: { body: CompanySettingsBody; version: number }) =>
      saveCompanySettings(body, version),
    onSuccess: (settings) => queryClient.setQueryData(jobKeys.settings(), settings),
  });
}
