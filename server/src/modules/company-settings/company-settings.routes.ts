import { settingsResponse } from '@contract';
import { ANY_STAFF, OWNER, type ApiRouter } from '../../lib/route';
import { presentCompanySettings } from './company-settings.presenter';
import { putCompanySettingsSchema } from './company-settings.schema';
import { getCompanySettings, putCompanySettings } from './company-settings.service';

export function companySettingsRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/settings',
    policy: ANY_STAFF,
    response: settingsResponse,
    versioned: (out) => out.settings.version,
    handler: async ({ service }) => ({ settings: presentCompanySettings(await getCompanySettings(service)) }),
  });
  api.route({
    method: 'put',
    path: '/settings',
    policy: OWNER,
    body: putCompanySettingsSchema,
    response: settingsResponse,
    versioned: (out) => out.settings.version,
    handler: async ({ service, body, ifMatch }) => ({
      settings: presentCompanySettings(await putCompanySettings(service, ifMatch, body)),
    }),
  });
}
