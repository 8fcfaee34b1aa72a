import type { Request } from 'express';

/** A browser's address and user agent as an audit trail keeps them. */
export interface RequestMeta {
  readonly ip: string | null;
  readonly userAgent: string | null;
}

/** The request's address (req.ip: trusted only through TRUST_PROXY) and user agent, cut to the trail's columns. */
export const requestMeta = (req: Request): RequestMeta => ({
  ip: req.ip ? req.ip.slice(0, 45) : null,
  userAgent: req.get('user-agent')?.slice(0, 400) ?? null,
});
