import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Accounts1764633600000 implements MigrationInterface {
  name = 'Accounts1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email varchar(254) NOT NULL,
        password_hash varchar(100) NOT NULL,
        display_name varchar(80) NOT NULL,
        role varchar(20) NOT NULL CHECK (role IN ('rider', 'staff', 'warehouse', 'admin')),
        disabled boolean NOT NULL DEFAULT false,
        token_version int NOT NULL DEFAULT 0,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX users_email_ci ON users (lower(email))`);
    await q.query(`
      CREATE TABLE password_reset_tokens (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        token_hash varchar(64) NOT NULL UNIQUE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX password_reset_tokens_user ON password_reset_tokens (user_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE password_reset_tokens`);
    await q.query(`DROP TABLE users`);
  }
}
