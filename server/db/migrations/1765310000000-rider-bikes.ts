import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RiderBikes1765310000000 implements MigrationInterface {
  name = 'RiderBikes1765310000000';

  async up(q: QueryRunner): Promise<void> {
    // A rider's saved bike: the finder's state kept under a nickname. Fitment and springs may be removed by the staff later.
    await q.query(`
      CREATE TABLE rider_bikes (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        nickname varchar(60) NOT NULL,
        fitment_id uuid REFERENCES fitments(id) ON DELETE SET NULL,
        bike_label varchar(200) NOT NULL,
        riding_style varchar(20) NOT NULL,
        load jsonb NOT NULL,
        cases jsonb NOT NULL DEFAULT '[]',
        fork_spring_id uuid REFERENCES products(id) ON DELETE SET NULL,
        shock_spring_id uuid REFERENCES products(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX rider_bikes_user ON rider_bikes (user_id, created_at)`);
    // Each check keeps the readings and the answer the server computed then, so later catalogue edits never rewrite history.
    await q.query(`
      CREATE TABLE rider_bike_sag_checks (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        bike_id uuid NOT NULL REFERENCES rider_bikes(id) ON DELETE CASCADE,
        end_name varchar(5) NOT NULL CHECK (end_name IN ('rear', 'front')),
        readings jsonb NOT NULL,
        targets jsonb NOT NULL,
        result jsonb NOT NULL,
        checked_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX rider_bike_sag_checks_bike ON rider_bike_sag_checks (bike_id, checked_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE rider_bike_sag_checks`);
    await q.query(`DROP TABLE rider_bikes`);
  }
}
