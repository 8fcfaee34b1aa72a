/**
 * The version of the API's shapes and rules. Raise it whenever a change would break a client
 * built before it (a field renamed or removed, a rule tightened, a route moved). The server sends
 * it on every /api answer (`X-Gaugeline-Api`), and refuses a write from a client built against
 * another version (412 `api-version`); the client compares it with the one it was built with and
 * asks the person to reload instead of mixing old code with a changed API. Changes waiting on
 * the device stay there and go once the new version has loaded.
 */
export const API_VERSION = 1;

export const API_VERSION_HEADER = 'X-Gaugeline-Api';
