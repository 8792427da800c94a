import type { ValidationError } from 'class-validator';

/**
 * Maps class-validator's nested errors to dotted field paths with the first message of each.
 * @example flattenValidationErrors(errors) // { 'springs.0.rateNPerMm': 'rate must be positive' }
 */
export function flattenValidationErrors(errors: ValidationError[], prefix = ''): Record<string, string> {
  const out: Record<string, string> = {};
  for (const e of errors) {
    const path = prefix ? `${prefix}.${e.property}` : e.property;
    const first = e.constraints ? Object.values(e.constraints)[0] : undefined;
    if (first !== undefined) out[path] = first;
    if (e.children?.length) Object.assign(out, flattenValidationErrors(e.children, path));
  }
  return out;
}
