/** One problem in an uploaded fitment CSV; line 1 is the header, column is the header's name. */
export interface CsvProblemDto {
  line: number;
  column: string;
  message: string;
}

/**
 * POST /api/staff/fitments/import/preview and POST /api/staff/fitments/import reply.
 * The import itself is all-or-nothing: with any problem nothing is written and the reply is 400
 * `{code: 'validation', message, details: CsvImportReportDto}`.
 */
export interface CsvImportReportDto {
  dryRun: boolean;
  rows: number;
  /** Rows without an id, or with an id not yet in the table. */
  created: number;
  /** Rows whose id exists and whose values differ. */
  updated: number;
  unchanged: number;
  problems: CsvProblemDto[];
  /** What staff should look at twice; it does not stop the import (see `fitmentWarnings`). */
  warnings: CsvProblemDto[];
}
