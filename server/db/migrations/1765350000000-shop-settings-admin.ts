import type { MigrationInterface, QueryRunner } from 'typeorm';

export class ShopSettingsAdmin1765350000000 implements MigrationInterface {
  name = 'ShopSettingsAdmin1765350000000';

  async up(q: QueryRunner): Promise<void> {
    // Ranges mirror shared/admin/shop-settings.ts, so a write that skipped the DTO still cannot store nonsense.
    await q.query(`
      ALTER TABLE shop_settings
        ADD COLUMN exchange_window_days int NOT NULL DEFAULT 30 CHECK (exchange_window_days BETWEEN 0 AND 365),
        ADD COLUMN low_stock_threshold int NOT NULL DEFAULT 3 CHECK (low_stock_threshold BETWEEN 0 AND 10000)`);
    // Recommendations served per day, for the dashboard's share that ended in a purchase; each server adds its count in batches.
    await q.query(`
      CREATE TABLE recommendation_counts (
        day date PRIMARY KEY,
        served int NOT NULL DEFAULT 0 CHECK (served >= 0)
      )`);
    await q.query(`CREATE INDEX orders_paid_at ON orders (paid_at) WHERE paid_at IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX orders_paid_at`);
    await q.query(`DROP TABLE recommendation_counts`);
    await q.query(`ALTER TABLE shop_settings DROP COLUMN low_stock_threshold, DROP COLUMN exchange_window_days`);
  }
}
