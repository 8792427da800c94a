import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, Max, Min } from 'class-validator';

// The plain values moved to ./constants (importable without class-validator); re-exported so server imports keep working.
export * from './constants';
import { maxPageSize } from './constants';

/** page (from 1) and pageSize (1..100); list query DTOs extend it. */
export class PageQueryDto {
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'Page is a whole number.' })
  @Min(1, { message: 'Page starts at 1.' })
  @Max(100_000, { message: 'Page is at most 100000.' })
  page?: number;

  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'Page size is a whole number.' })
  @Min(1, { message: 'Page size is at least 1.' })
  @Max(maxPageSize, { message: `Page size is at most ${maxPageSize}.` })
  pageSize?: number;
}

export const isIn = <T extends readonly string[]>(values: T, what: string) =>
  IsIn(values as unknown as string[], { message: `${what} must be one of ${values.join(', ')}.` });
