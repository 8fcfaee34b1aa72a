/**
 * Who was last signed in on this device (company + user id), kept in localStorage so the app can
 * restore that person's saved queries before the first page loads (persist-cache.ts). Apart from
 * persist-cache so the start-up can ask "anyone saved?" without loading the cache machinery: the
 * sign-in page of a device nobody has used yet does not need it (issue 11's sign-in budget).
 */
export const LAST_PERSON_KEY = 'gaugeline:last-person';

export function hasSavedPerson(): boolean {
  try {
    return localStorage.getItem(LAST_PERSON_KEY) !== null;
  } catch {
    return false;
  }
}
