import type { RequestHandler } from 'express';
import { plainToInstance, type ClassConstructor } from 'class-transformer';
import { validate } from 'class-validator';
import { flattenValidationErrors } from '../../shared/dto/validation';
import { AppError } from '../errors';

/** Parses req.body into the DTO class and refuses it with per-field messages when it does not fit. */
export async function parseBody<T extends object>(cls: ClassConstructor<T>, body: unknown): Promise<T> {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw AppError.validation('The request body must be a JSON object.', { body: 'must be a JSON object' });
  }
  const dto = plainToInstance(cls, body);
  const errors = await validate(dto, { whitelist: true, forbidNonWhitelisted: true, forbidUnknownValues: true });
  if (errors.length) {
    throw AppError.validation('Some fields need attention.', flattenValidationErrors(errors));
  }
  return dto;
}

export function body<T extends object>(cls: ClassConstructor<T>): RequestHandler {
  return async (req, _res, next) => {
    req.body = await parseBody(cls, req.body);
    next();
  };
}
