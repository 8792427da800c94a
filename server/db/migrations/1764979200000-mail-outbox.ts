import type { MigrationInterface, QueryRunner } from 'typeorm';

export class MailOutbox1764979200000 implements MigrationInterface {
  name = 'MailOutbox1764979200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE mail_outbox (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        dedupe_key varchar(200) NOT NULL,
        recipient varchar(254) NOT NULL,
        subject varchar(300) NOT NULL,
        text_body text NOT NULL,
        html_body text NOT NULL,
        attempts int NOT NULL DEFAULT 0,
        last_error text,
        sent_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX mail_outbox_dedupe_key ON mail_outbox (dedupe_key)`);
    await q.query(`CREATE INDEX mail_outbox_unsent ON mail_outbox (created_at) WHERE sent_at IS NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE mail_outbox`);
  }
}
