import { z } from 'zod';

/*
 * Apart from the other field rules (fields.ts) because the jobs list's URL filters use them in the signed-in
 * shell, the code every page loads first: with them there, a phone built every form's rules (users,
 * customers, sites, passwords) before the walk-through could show (issue 11).
 */

/** The search and paging of every list. */
export const listQueryFields = {
  search: z.string().trim().max(100, { message: 'Search must be at most 100 characters.' }).optional(),
  page: z.coerce
    .number({ message: 'Page must be a number.' })
    .int({ message: 'Page must be a whole number.' })
    .min(1, { message: 'Page starts at 1.' })
    .max(100_000, { message: 'Page is too large.' })
    .default(1),
  pageSize: z.coerce
    .number({ message: 'Page size must be a number.' })
    .int({ message: 'Page size must be a whole number.' })
    .min(1, { message: 'Page size must be between 1 and 100.' })
    .max(100, { message: 'Page size must be between 1 and 100.' })
    .default(25),
};
