import type { MigrationInterface, QueryRunner } from 'typeorm';

export class RateLimitCounters1764892800000 implements MigrationInterface {
  name = 'RateLimitCounters1764892800000';

  async up(q: QueryRunner): Promise<void> {
    // Unlogged: counters are rewritten on every limited request and losing them in a crash only reopens a window early.
    // Keys are digests (see the store); the fillfactor leaves room on each page so a counter is rewritten in place.
    await q.query(`
      CREATE UNLOGGED TABLE rate_limit_counters (
        limiter varchar(40) NOT NULL,
        key varchar(64) NOT NULL,
        hits int NOT NULL CHECK (hits >= 0),
        reset_at timestamptz NOT NULL,
        PRIMARY KEY (limiter, key)
      ) WITH (fillfactor = 70)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE rate_limit_counters`);
  }
}
