import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { priceBookSettingsSchema, sellRuleSchema, type PriceBookSettings } from '@calc';
import { apiFetch } from '../../../lib/api-client';
import { priceBookKeys } from '../query-keys';

const SETTINGS = '/api/company-data/settings';

const settingsResponse = z.object({
  settings: z.object({
    taxRatePercent: z.number(),
    taxAppliesTo: priceBookSettingsSchema.shape.taxAppliesTo,
    /** Only the office receives it. */
    defaultSellRule: sellRuleSchema.optional(),
    version: z.number().int(),
  }),
});

export const settingsQueryOptions = () =>
  queryOptions({
    queryKey: [...priceBookKeys.all, 'settings'] as const,
    queryFn: async ({ signal }) => (await apiFetch(SETTINGS, { schema: settingsResponse, signal })).settings,
  });

export const useSettings = () => useSuspenseQuery(settingsQueryOptions()).data;

export function useSaveSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async ({ settings, version }: { settings: PriceBookSettings; version: number }) =>
      (await apiFetch(SETTINGS, { method: 'PUT', body: { settings }, version, schema: settingsResponse })).settings,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: priceBookKeys.all }),
  });
}
