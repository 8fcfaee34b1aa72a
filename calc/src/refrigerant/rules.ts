import type { Refrigerant } from './charge';
import { REFRIGERANT_INFO } from './a2l';

/**
 * The US Technology Transitions rule for new residential split air conditioners and heat pumps
 * [PUB: 40 CFR Part 84 Subpart B, final rule 88 FR 73098 (24 Oct 2023): refrigerant GWP below 700
 * for split systems installed from 1 Jan 2025; interim final rule 88 FR 88825 (26 Dec 2023): systems
 * whose components were all made or imported before 1 Jan 2025 may be installed until 1 Jan 2026].
 * EPA said in 2025 it would reconsider the rule, so the result always carries that note.
 */
export const TECHNOLOGY_TRANSITIONS = {
  name: 'US EPA Technology Transitions rule (40 CFR Part 84 Subpart B)',
  gwpLimit: 700,
  fromDate: '2025-01-01',
  componentAllowanceUntil: '2026-01-01',
  note: 'The rule may change (EPA announced a reconsideration in 2025): check the rule in force before ordering.',
} as const;

export interface RefrigerantRuleCheck {
  readonly refrigerant: Refrigerant;
  readonly gwp: number;
  /** 'allowed' below the GWP limit; 'allowed-old-components' inside the one-year allowance; 'not-allowed'; 'check-date' without an install date. */
  readonly verdict: 'allowed' | 'allowed-old-components' | 'not-allowed' | 'check-date';
  readonly message: string;
  readonly blocker: boolean;
}

/**
 * Whether a new split system with this refrigerant may be installed on `installDate` (YYYY-MM-DD,
 * compared as text: ISO dates sort by date). No date → a warning naming both dates.
 */
export function technologyTransitionsCheck({
  refrigerant,
  installDate,
  componentsMadeBefore2025,
}: {
  readonly refrigerant: Refrigerant;
  readonly installDate?: string | undefined;
  readonly componentsMadeBefore2025?: boolean | undefined;
}): RefrigerantRuleCheck {
  const r = TECHNOLOGY_TRANSITIONS;
  const gwp = REFRIGERANT_INFO[refrigerant].gwp;
  if (gwp < r.gwpLimit)
    return {
      refrigerant,
      gwp,
      verdict: 'allowed',
      message: `${refrigerant} (GWP ${gwp}) is below the ${r.gwpLimit} limit of the ${r.name}.`,
      blocker: false,
    };
  const head = `${refrigerant} has a GWP of ${gwp}, above the ${r.gwpLimit} limit for new residential split systems under the ${r.name} from ${r.fromDate}`;
  if (installDate === undefined)
    return {
      refrigerant,
      gwp,
      verdict: 'check-date',
      message: `${head}; only systems whose components were all made before ${r.fromDate} may be installed, and only until ${r.componentAllowanceUntil}. Enter the install date. ${r.note}`,
      blocker: false,
    };
  if (installDate < r.fromDate)
    return {
      refrigerant,
      gwp,
      verdict: 'allowed',
      message: `${head}; an install on ${installDate} is before the rule applies. ${r.note}`,
      blocker: false,
    };
  if (installDate < r.componentAllowanceUntil && componentsMadeBefore2025 === true)
    return {
      refrigerant,
      gwp,
      verdict: 'allowed-old-components',
      message: `${head}; an install on ${installDate} is allowed because every component was made before ${r.fromDate} (allowance until ${r.componentAllowanceUntil}). ${r.note}`,
      blocker: false,
    };
  return {
    refrigerant,
    gwp,
    verdict: 'not-allowed',
    message:
      installDate < r.componentAllowanceUntil
        ? `${head}; an install on ${installDate} is allowed only if every component was made before ${r.fromDate}: confirm that, or choose a unit with a lower-GWP refrigerant. ${r.note}`
        : `${head}; a new system may not be installed with it on ${installDate}: choose a unit with a lower-GWP refrigerant. ${r.note}`,
    blocker: true,
  };
}
