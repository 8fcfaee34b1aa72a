/**
 * The time zones a job site may be in, from the state or region typed on the job (a US state's postal
 * code or its name). The right-to-cancel window is counted on the site's local calendar (16 CFR 429.1(a):
 * "midnight of the third business day after the date of this transaction"), and a job keeps no time
 * zone of its own, only its state. Where a state spans more than one zone, or the region is not a US
 * state we know, the window is worked out in each candidate zone and the buyer gets the latest close
 * (modules/cancellations/cancellation-window.ts): honouring a cancellation a few hours late costs the seller nothing, refusing
 * one inside the buyer's window breaks the rule.
 *
 * Which states span which zones (IANA names) is from memory of the US zone boundaries (49 CFR Part 71
 * draws them; not re-read for this table): the first zone of each list is the one most of the state keeps.
 */

const E = 'America/New_York';
const C = 'America/Chicago';
const M = 'America/Denver';
const P = 'America/Los_Angeles';

const BY_STATE: Record<string, { name: string; zones: readonly string[] }> = {
  AL: { name: 'Alabama', zones: [C] },
  AK: { name: 'Alaska', zones: ['America/Anchorage', 'America/Adak'] },
  AZ: { name: 'Arizona', zones: ['America/Phoenix', M] },
  AR: { name: 'Arkansas', zones: [C] },
  CA: { name: 'California', zones: [P] },
  CO: { name: 'Colorado', zones: [M] },
  CT: { name: 'Connecticut', zones: [E] },
  DE: { name: 'Delaware', zones: [E] },
  DC: { name: 'District of Columbia', zones: [E] },
  FL: { name: 'Florida', zones: [E, C] },
  GA: { name: 'Georgia', zones: [E] },
  HI: { name: 'Hawaii', zones: ['Pacific/Honolulu'] },
  ID: { name: 'Idaho', zones: ['America/Boise', P] },
  IL: { name: 'Illinois', zones: [C] },
  IN: { name: 'Indiana', zones: ['America/Indiana/Indianapolis', C] },
  IA: { name: 'Iowa', zones: [C] },
  KS: { name: 'Kansas', zones: [C, M] },
  KY: { name: 'Kentucky', zones: ['America/Kentucky/Louisville', C] },
  LA: { name: 'Louisiana', zones: [C] },
  ME: { name: 'Maine', zones: [E] },
  MD: { name: 'Maryland', zones: [E] },
  MA: { name: 'Massachusetts', zones: [E] },
  MI: { name: 'Michigan', zones: ['America/Detroit', 'America/Menominee'] },
  MN: { name: 'Minnesota', zones: [C] },
  MS: { name: 'Mississippi', zones: [C] },
  MO: { name: 'Missouri', zones: [C] },
  MT: { name: 'Montana', zones: [M] },
  NE: { name: 'Nebraska', zones: [C, M] },
  NV: { name: 'Nevada', zones: [P, M] },
  NH: { name: 'New Hampshire', zones: [E] },
  NJ: { name: 'New Jersey', zones: [E] },
  NM: { name: 'New Mexico', zones: [M] },
  NY: { name: 'New York', zones: [E] },
  NC: { name: 'North Carolina', zones: [E] },
  ND: { name: 'North Dakota', zones: [C, M] },
  OH: { name: 'Ohio', zones: [E] },
  OK: { name: 'Oklahoma', zones: [C] },
  OR: { name: 'Oregon', zones: [P, 'America/Boise'] },
  PA: { name: 'Pennsylvania', zones: [E] },
  RI: { name: 'Rhode Island', zones: [E] },
  SC: { name: 'South Carolina', zones: [E] },
  SD: { name: 'South Dakota', zones: [C, M] },
  TN: { name: 'Tennessee', zones: [C, E] },
  TX: { name: 'Texas', zones: [C, M] },
  UT: { name: 'Utah', zones: [M] },
  VT: { name: 'Vermont', zones: [E] },
  VA: { name: 'Virginia', zones: [E] },
  WA: { name: 'Washington', zones: [P] },
  WV: { name: 'West Virginia', zones: [E] },
  WI: { name: 'Wisconsin', zones: [C] },
  WY: { name: 'Wyoming', zones: [M] },
  PR: { name: 'Puerto Rico', zones: ['America/Puerto_Rico'] },
  VI: { name: 'U.S. Virgin Islands', zones: ['America/St_Thomas'] },
  GU: { name: 'Guam', zones: ['Pacific/Guam'] },
  AS: { name: 'American Samoa', zones: ['Pacific/Pago_Pago'] },
  MP: { name: 'Northern Mariana Islands', zones: ['Pacific/Saipan'] },
};

const key = (s: string) =>
  s
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z]/g, '');

const LOOKUP = new Map<string, readonly string[]>();
for (const [code, { name, zones }] of Object.entries(BY_STATE)) {
  LOOKUP.set(key(code), zones);
  LOOKUP.set(key(name), zones);
}

/** Every zone of the table, for a region we cannot place (the buyer then gets the latest close of all). */
export const EVERY_SITE_ZONE: readonly string[] = [...new Set(Object.values(BY_STATE).flatMap((s) => s.zones))];

/** The site's candidate zones and whether the region was recognised. */
export function siteTimeZones(region: string): { zones: readonly string[]; known: boolean } {
  const zones = LOOKUP.get(key(region));
  return zones ? { zones, known: true } : { zones: EVERY_SITE_ZONE, known: false };
}
