import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError, statusOfKind } from '../errors';

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new AppError('not-found', `No API route for ${req.method} ${req.path}.`));
};

/** The one place that turns errors into replies; unknown errors are logged and never leak internals. */
export const errorMiddleware: ErrorRequestHandler = (err, req, res, _next) => {
  const appError = toAppError(err);
  if (appError) {
    res.status(statusOfKind[appError.kind]).json({
      code: appError.kind,
      message: appError.message,
      ...(appError.fields ? { fields: appError.fields } : {}),
      ...(appError.details !== undefined ? { details: appError.details } : {}),
    });
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  if (res.headersSent) return;
  res.status(500).json({ code: 'internal', message: 'Something went wrong on our side. Please try again.' });
};

function toAppError(err: unknown): AppError | undefined {
  if (err instanceof AppError) return err;
  const e = err as { type?: string; status?: number; code?: string } | undefined;
  // body-parser's own failures: malformed JSON, too large, bad charset.
  if (e?.type === 'entity.parse.failed') return AppError.validation('The request body is not valid JSON.', { body: 'is not valid JSON' });
  if (e?.type === 'entity.too.large') return new AppError('too-large', 'The request body is too large.');
  if (e?.type === 'charset.unsupported' || e?.type === 'encoding.unsupported') return AppError.validation('Unsupported body encoding.', { body: 'unsupported encoding' });
  // The router could not percent-decode a path segment: the address itself is malformed.
  if (err instanceof URIError && e?.status === 400) return AppError.validation('The address is not valid.', { path: 'has a broken %-escape' });
  // body-parser's other refusals of an unreadable body (e.g. compressed data that does not inflate) carry a 400.
  if (e?.status === 400 && (err as { expose?: boolean }).expose === true) return AppError.validation('The request body could not be read.', { body: 'could not be read' });
  // The static file server's refusal of a missing file (it wraps the file system's ENOENT in a 404).
  if (e?.status === 404) return AppError.notFound('The file');
  // A database that is away is a temporary outage, not a bug.
  if (e?.code === 'ECONNREFUSED' || e?.code === '57P01' || (err instanceof Error && /Connection terminated|timeout exceeded when trying to connect/.test(err.message))) {
    return new AppError('unavailable', 'The service is briefly unavailable. Please try again in a moment.');
  }
  return undefined;
}
