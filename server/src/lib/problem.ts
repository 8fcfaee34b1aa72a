import type { ErrorRequestHandler, RequestHandler, Response } from 'express';
import {
  DriverException,
  ConnectionException,
  OptimisticLockError,
  UniqueConstraintViolationException,
} from '@mikro-orm/core';
import { ZodError } from 'zod';
import { CalcError } from '@calc';
import {
  AppError,
  BadRequestError,
  ConflictError,
  NotFoundError,
  PayloadTooLargeError,
  RateLimitedError,
  ServiceUnavailableError,
  UnsupportedMediaTypeError,
  ValidationError,
} from './errors';
import { zodToFieldErrors } from './validate';

export const PROBLEM_BASE = '/problems/';

export function sendProblem(res: Response, err: AppError, instance?: string): void {
  if (err instanceof RateLimitedError) res.setHeader('Retry-After', String(err.retryAfterSeconds));
  res
    .status(err.status)
    .type('application/problem+json')
    .setHeader('Cache-Control', 'no-store')
    .send(
      JSON.stringify({
        type: `${PROBLEM_BASE}${err.code}`,
        title: err.title,
        status: err.status,
        detail: err.message,
        ...(instance ? { instance } : {}),
        ...err.extra,
      }),
    );
}

interface HttpLikeError {
  status?: number;
  statusCode?: number;
  type?: string;
  code?: string;
}

function isHttpLike(e: unknown): e is HttpLikeError {
  return typeof e === 'object' && e !== null && ('status' in e || 'statusCode' in e || 'type' in e);
}

/** Maps what libraries throw (body-parser, multer, MikroORM, the pg driver, zod, calc) onto our vocabulary. */
export function toAppError(err: unknown): AppError | undefined {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return new ValidationError(zodToFieldErrors(err));
  if (err instanceof OptimisticLockError)
    return new ConflictError('Someone else changed this record. Reload to see their changes.');
  if (err instanceof UniqueConstraintViolationException)
    return new ConflictError('A record with these details already exists.');
  if (err instanceof ConnectionException) return new ServiceUnavailableError();
  if (err instanceof DriverException) {
    // SQLSTATE classes: 22 data exception, 23 integrity violation → the input was wrong, not the server.
    const sqlState = err.code ?? '';
    if (sqlState.startsWith('22') || sqlState.startsWith('23'))
      return new BadRequestError('The data does not fit the allowed values.');
    if (sqlState.startsWith('08') || sqlState === '57P01' || sqlState === '53300') return new ServiceUnavailableError();
    return undefined;
  }
  if (err instanceof CalcError) {
    const errors = err.details.map((d) => ({ path: d.path.map(String).join('.'), message: d.message }));
    return new AppError(422, 'calc', 'Cannot be calculated', err.message, errors.length ? { errors } : {});
  }
  if (isHttpLike(err)) {
    const status = err.status ?? err.statusCode;
    if (err.type === 'entity.parse.failed') return new BadRequestError('The request body is not valid JSON.');
    if (err.type === 'entity.too.large' || status === 413) return new PayloadTooLargeError();
    if (err.type === 'encoding.unsupported' || err.type === 'charset.unsupported' || status === 415)
      return new UnsupportedMediaTypeError();
    if (err.code === 'LIMIT_FILE_SIZE') return new PayloadTooLargeError('The file is too large.');
    if (typeof err.code === 'string' && err.code.startsWith('LIMIT_'))
      return new BadRequestError('The upload does not fit the allowed limits.');
    if (status === 400) return new BadRequestError('The request could not be read.');
  }
  return undefined;
}

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new NotFoundError(`${req.method} ${req.path}`));
};

export const problemHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) {
    // The answer is already on its way (e.g. the session store failed while saving after it): log, never answer twice.
    req.log?.error({ err }, 'error after the answer was sent');
    return;
  }
  const known = toAppError(err);
  if (known) {
    if (known.status >= 500) req.log?.warn({ err }, 'service unavailable');
    sendProblem(res, known, req.originalUrl.split('?')[0]);
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  const id = typeof req.id === 'string' || typeof req.id === 'number' ? String(req.id) : undefined;
  sendProblem(
    res,
    new AppError(
      500,
      'internal',
      'Internal error',
      'Something went wrong on our side. It has been logged.',
      id ? { requestId: id } : {},
    ),
  );
};
