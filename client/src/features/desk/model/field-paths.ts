import { ApiError, isApiError } from '../../../lib/api-error';

/** A server error's path on the request body ("pricing.discounts.0.value") as the form's field ("discounts.0.value"). */
export const fieldPathIn = (member: string, path: string): string =>
  path.startsWith(`${member}.`) ? path.slice(member.length + 1) : path;

/**
 * The server's field errors for one member of the body (the PATCH sends { design } or { pricing }) re-rooted
 * onto the form that edits that member, so the Form wrapper places each message beside its field.
 */
export function errorOnFields(e: unknown, member: string): unknown {
  if (!isApiError(e)) return e;
  return new ApiError({
    status: e.status,
    code: e.code,
    title: e.title,
    detail: e.detail,
    errors: e.errors.map((x) => ({ path: fieldPathIn(member, x.path), message: x.message })),
    retryAfter: e.retryAfter,
  });
}
