import { isApiError } from '../api-error';
import type { SendResult } from './queue';

export const OTHER_PERSON =
  'Someone else is signed in on this device now. These changes stay here until you sign in again.';

/**
 * What a failed queued write means to the queue (every feature's sender maps its errors through this):
 * no connection, 5xx or 429 → try again later; 409/428 → ask the person (conflict); 401, another person
 * signed in or another API version → keep it and say why (blocked); any other 4xx → refused (dropped, in
 * the server's words).
 */
export function sendFailure(e: unknown): SendResult {
  if (isApiError(e)) {
    if (e.code === 'network' || e.status === 0) return { kind: 'network' };
    // Another person signed in on this device (another tab): these changes wait for their maker.
    if (e.code === 'other-person') return { kind: 'blocked', message: OTHER_PERSON };
    // The server was updated past this page: keep the edits for the reloaded app to send.
    if (e.code === 'api-version') return { kind: 'blocked', message: e.detail };
    // 428 means the edit carried no version: never drop it, ask the person as for a 409.
    if (e.status === 409 || e.status === 428) return { kind: 'conflict' };
    if (e.status === 401)
      return {
        kind: 'blocked',
        message:
          'Your session has ended. Sign in again (in another tab keeps this page); your changes stay on this device until then.',
      };
    // 5xx may pass; keep the edit and try again later rather than lose it.
    if (e.status >= 500 || e.status === 429) return { kind: 'network' };
    const fields = e.errors.map((f) => f.message).join(' ');
    return { kind: 'rejected', message: fields ? `${e.detail} ${fields}` : e.detail };
  }
  return { kind: 'network' };
}
