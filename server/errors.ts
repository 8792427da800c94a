export type AppErrorKind =
  | 'validation'
  | 'unauthorised'
  | 'forbidden'
  | 'not-found'
  | 'conflict'
  | 'payment'
  | 'unavailable'
  | 'rate-limited'
  | 'too-large';

export const statusOfKind: Record<AppErrorKind, number> = {
  validation: 400,
  unauthorised: 401,
  payment: 402,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  'too-large': 413,
  'rate-limited': 429,
  unavailable: 503,
};

/** The one error type services throw; the error middleware turns it into a reply. */
export class AppError extends Error {
  constructor(
    readonly kind: AppErrorKind,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }

  static validation(message: string, fields?: Record<string, string>) {
    return new AppError('validation', message, fields);
  }
  static notFound(what: string) {
    return new AppError('not-found', `${what} was not found.`);
  }
}
