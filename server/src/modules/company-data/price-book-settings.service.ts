import type { EntityManager } from '@mikro-orm/postgresql';
import { priceBookSettingsSchema, type DataRole, type PriceBookSettings } from '@calc';
import type { ServiceContext } from '../../lib/service-context';
import { CompanySchema } from '../companies/company.entity';
import { assertVersion } from '../../lib/version-lock';
import { PriceBookSettingsSchema } from './company-data.entity';

/** Until the owner saves: no tax and a 40 % margin [OWN: a neutral starting point, not advice]. */
export const DEFAULT_PRICE_BOOK_SETTINGS: PriceBookSettings = {
  taxRatePercent: 0,
  taxAppliesTo: 'materials',
  defaultSellRule: { method: 'margin', percent: 40 },
};

export function presentSettings(s: { data: PriceBookSettings; version: number }, role: DataRole) {
  const office = role === 'owner' || role === 'estimator';
  return {
    taxRatePercent: s.data.taxRatePercent,
    taxAppliesTo: s.data.taxAppliesTo,
    ...(office ? { defaultSellRule: s.data.defaultSellRule } : {}),
    version: s.version,
  };
}

/** A company's settings (keyed by company: the desk reads them too). */
export async function getSettings(em: EntityManager, companyId: string) {
  const row = await em.findOne(PriceBookSettingsSchema, { company: companyId });
  return row ? { data: row.data, version: row.version } : { data: DEFAULT_PRICE_BOOK_SETTINGS, version: 0 };
}

export async function putSettings({ em, actor }: ServiceContext, version: number, input: PriceBookSettings) {
  const data = priceBookSettingsSchema.parse(input);
  const row = await em.findOne(PriceBookSettingsSchema, { company: actor.companyId });
  assertVersion(version, row?.version ?? 0, 'The price-book settings', () =>
    presentSettings(row ?? { data: DEFAULT_PRICE_BOOK_SETTINGS, version: 0 }, actor.role),
  );
  const saved =
    row ?? em.create(PriceBookSettingsSchema, { company: em.getReference(CompanySchema, actor.companyId), data });
  saved.data = data;
  await em.flush();
  return { data: saved.data, version: saved.version };
}
