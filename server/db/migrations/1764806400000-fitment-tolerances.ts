import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Static-sag tolerances per end, the number of shocks, and the stock fork spacer and preload. */
export class FitmentTolerances1764806400000 implements MigrationInterface {
  name = 'FitmentTolerances1764806400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE fitments
        ADD COLUMN shock_count int NOT NULL DEFAULT 1 CHECK (shock_count IN (1, 2)),
        ADD COLUMN fork_stock_spacer_mm double precision,
        ADD COLUMN fork_stock_preload_mm double precision,
        ADD COLUMN front_static_sag_tolerance_mm double precision NOT NULL DEFAULT 3,
        ADD COLUMN rear_static_sag_tolerance_mm double precision NOT NULL DEFAULT 3`);
    // Rows saved before the stock preload was kept take the bottom of their preload range, as a new input does.
    await q.query(`UPDATE fitments SET fork_stock_preload_mm = fork_preload_min_mm`);
    await q.query(`ALTER TABLE fitments ALTER COLUMN fork_stock_preload_mm SET NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE fitments
        DROP COLUMN rear_static_sag_tolerance_mm,
        DROP COLUMN front_static_sag_tolerance_mm,
        DROP COLUMN fork_stock_preload_mm,
        DROP COLUMN fork_stock_spacer_mm,
        DROP COLUMN shock_count`);
  }
}
