import type { EntityManager } from '@mikro-orm/postgresql';
import type { DesignConditions } from '@calc';
import { NotFoundError } from '../../lib/errors';
import type { ServiceContext } from '../../lib/service-context';
import { CompanySchema } from '../companies/company.entity';
import { assertVersion } from '../../lib/version-lock';
import { presentCompanySettings, type SettingsView } from './company-settings.presenter';
import { CompanySettingsSchema } from './company-settings.entity';
import type { PutCompanySettingsInput } from './company-settings.schema';

export async function getCompanySettings({ em, actor }: ServiceContext): Promise<SettingsView> {
  const companyId = actor.companyId;
  const company = await em.findOne(CompanySchema, { id: companyId });
  if (!company) throw new NotFoundError('The company');
  const row = await em.findOne(CompanySettingsSchema, { company: companyId });
  return {
    unitSystem: company.unitSystem,
    defaultDesignConditions: row?.defaultDesignConditions ?? null,
    version: row?.version ?? 0,
    updatedAt: row?.updatedAt ?? null,
  };
}

/** The defaults a new job's design conditions start from (null when the owner has set none). */
export async function companyDesignDefaults(em: EntityManager, companyId: string): Promise<DesignConditions | null> {
  const row = await em.findOne(CompanySettingsSchema, { company: companyId });
  return row?.defaultDesignConditions ?? null;
}

export async function putCompanySettings(
  { em, actor }: ServiceContext,
  version: number,
  input: PutCompanySettingsInput,
): Promise<SettingsView> {
  const company = await em.findOne(CompanySchema, { id: actor.companyId });
  if (!company) throw new NotFoundError('The company');
  const existing = await em.findOne(CompanySettingsSchema, { company: actor.companyId });
  const current = {
    unitSystem: company.unitSystem,
    defaultDesignConditions: existing?.defaultDesignConditions ?? null,
    version: existing?.version ?? 0,
    updatedAt: existing?.updatedAt ?? null,
  };
  assertVersion(version, current.version, 'The company settings', () => presentCompanySettings(current));
  const row = existing ?? em.create(CompanySettingsSchema, { company, defaultDesignConditions: null });
  row.defaultDesignConditions = input.defaultDesignConditions;
  company.unitSystem = input.unitSystem;
  await em.flush();
  return {
    unitSystem: company.unitSystem,
    defaultDesignConditions: row.defaultDesignConditions ?? null,
    version: row.version,
    updatedAt: row.updatedAt,
  };
}
