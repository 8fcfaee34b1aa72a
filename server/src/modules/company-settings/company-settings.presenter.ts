import type { DesignConditions } from '@calc';
import type { CompanySettingsRecord, UnitSystem } from '@contract';

export interface SettingsView {
  unitSystem: UnitSystem;
  defaultDesignConditions: DesignConditions | null;
  /** 0 until the owner first saves; send it back as If-Match: "0". */
  version: number;
  updatedAt: Date | null;
}

export function presentCompanySettings(s: SettingsView): CompanySettingsRecord {
  return {
    unitSystem: s.unitSystem,
    defaultDesignConditions: s.defaultDesignConditions,
    version: s.version,
    updatedAt: s.updatedAt ? s.updatedAt.toISOString() : null,
    designConditionsNotice:
      'Design values must come from the local code’s climate table or a recognised climatic data source for the site.',
  };
}
