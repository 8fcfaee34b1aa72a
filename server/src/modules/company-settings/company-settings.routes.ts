import { ANY_STAFF, OWNER, type ApiRouter } from '../../lib/route';
import { ifMatchVersion, setEtag } from '../jobs/version-lock';
import { presentCompanySettings } from './company-settings.presenter';
import { putCompanySettingsSchema } from './company-settings.schema';
import { getCompanySettings, putCompanySettings } from './company-settings.service';

export function companySettingsRoutes(api: ApiRouter): void {
  api.route({
    method: 'get',
    path: '/settings',
    policy: ANY_STAFF,
    handler: async ({ em, actor, res }) => {
      const s = await getCompanySettings(em, actor.companyId);
      setEtag(res, s.version);
      return { settings: presentCompanySettings(s) };
    },
  });
  api.route({
    method: 'put',
    path: '/settings',
    policy: OWNER,
    body: putCompanySettingsSchema,
    handler: async ({ em, actor, body, req, res }) => {
      const s = await putCompanySettings(em, actor, ifMatchVersion(req), body);
      setEtag(res, s.version);
      return { settings: presentCompanySettings(s) };
    },
  });
}
