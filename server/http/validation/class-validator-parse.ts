import { plainToInstance } from 'class-transformer';
import { validateSync, type ValidatorOptions } from 'class-validator';
import { flattenValidationErrors } from '../../../shared/dto/validation';
import type { Parsed } from './compiled-validator';
import { memoiseValidationMetadata } from '../validation-metadata-cache';

memoiseValidationMetadata();

// No request DTO has an asynchronous constraint, so the synchronous validator skips a promise per request.
export const validatorOptions: ValidatorOptions = { whitelist: true, forbidNonWhitelisted: true, forbidUnknownValues: true };

/**
 * The libraries' own path: class-transformer builds the instance, class-validator checks it. The compiled runner
 * must answer as this does; it also runs for a class the runner cannot mirror.
 */
export function classValidatorParse<T extends object>(cls: new () => T, input: object): Parsed<T> {
  const dto = plainToInstance(cls, input);
  const errors = validateSync(dto, validatorOptions);
  return errors.length ? { ok: false, fields: flattenValidationErrors(errors) } : { ok: true, value: dto };
}
