import type { Response } from 'express';

/** The service's error shape: a 4xx with {error: {type, code?, message, param?}}. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: string,
    message: string,
    readonly code?: string,
    readonly param?: string,
  ) {
    super(message);
  }
}

export function sendError(res: Response, e: ApiError): void {
  res.status(e.status).json({ error: { type: e.type, message: e.message, ...(e.code ? { code: e.code } : {}), ...(e.param ? { param: e.param } : {}) } });
}

export const missing = (what: string, id: string, param = 'id') => new ApiError(404, 'invalid_request_error', `No such ${what}: '${id}'`, 'resource_missing', param);
export const invalid = (message: string, param?: string) => new ApiError(400, 'invalid_request_error', message, 'parameter_invalid', param);
