import type { siteRules } from './fields';

/*
 * Zod-free, apart from the site's rules (fields.ts): the walk-through's offline overlay reads this list in the
 * signed-in shell, the code every page loads first, and importing it from fields.ts built every form's rules
 * there (users, customers, sites, passwords) before the walk-through could show (issue 11).
 */

/** The address fields of a site (its rules without the notes), in the order a form shows them. */
export const ADDRESS_FIELDS = [
  'street',
  'unit',
  'city',
  'region',
  'postalCode',
] as const satisfies readonly (keyof typeof siteRules)[];
