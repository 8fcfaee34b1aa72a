import { tightnessSchema } from '@calc';

/** The lists of values both ends (and the database's CHECK constraints) agree on. */

export const ROLES = ['owner', 'estimator', 'salesperson', 'installer'] as const;
export type Role = (typeof ROLES)[number];

/** Later issues add states after these; the order is the usual life of a job. */
export const JOB_STATUSES = ['walkthrough', 'design', 'proposed', 'won', 'lost', 'installed'] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

/** Envelope tightness: calc's list (its construction defaults are keyed by it), so there is one copy. */
export const TIGHTNESS = tightnessSchema.options;
export type Tightness = (typeof TIGHTNESS)[number];

export const UNIT_SYSTEMS = ['imperial', 'metric'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/**
 * Where a design value came from. entered: typed for this job; company-default: taken from the company
 * settings; standard-default: neither gave a value, so calc's built-in default (e.g. 75 °F indoor cooling) applies.
 */
export const DESIGN_VALUE_SOURCES = ['entered', 'company-default', 'standard-default'] as const;
export type DesignValueSource = (typeof DESIGN_VALUE_SOURCES)[number];
